import "next-auth";
import "next-auth/jwt";

declare module "next-auth" {
  interface Session {
    user: { id: string; email: string; name: string; isAdmin: boolean; sid?: string };
  }
}

declare module "next-auth/jwt" {
  interface JWT {
    isAdmin?: boolean;
    /** The server-side session row (db/schema/sessions.ts) this cookie belongs to. */
    sid?: string;
  }
}
