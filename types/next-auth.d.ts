import "next-auth";

declare module "next-auth" {
  interface User {
    orgId?: string;
  }
  interface Session {
    user: { id: string; name?: string | null; email?: string | null; orgId?: string };
  }
}
