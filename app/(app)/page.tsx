import { redirect } from "next/navigation";
import { currentContext } from "@/lib/auth/session";
import { homeFor } from "@/lib/auth/roles";

export default async function Home() {
  const ctx = await currentContext();
  redirect(ctx ? homeFor(ctx.roles) : "/sign-in");
}
