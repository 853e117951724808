"use server";

import { z } from "zod";
import { signOut } from "@/auth";
import { defineAction } from "@/lib/auth/action";

/** Open to anyone: signing out a session that has already ended must still clear the browser's cookie. */
export const signOutAction = defineAction({
  access: "public",
  read: () => ({}),
  schema: z.object({}),
  run: () => signOut({ redirectTo: "/sign-in" }),
});
