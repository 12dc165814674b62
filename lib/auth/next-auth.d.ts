import type { DefaultSession } from "next-auth";

declare module "next-auth" {
  interface Session {
    user: DefaultSession["user"] & { id: string; roles: string[]; schoolId: string };
  }
}

declare module "next-auth/jwt" {
  interface JWT {
    roles?: string[];
    schoolId?: string;
  }
}
