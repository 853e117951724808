import "next-auth";

declare module "next-auth" {
  interface User {
    orgId?: string;
    roles?: string[];
  }
  interface Session {
    user: { id: string; name?: string | null; email?: string | null; orgId?: string; roles?: string[] };
  }
}
