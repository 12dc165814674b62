import NextAuth from "next-auth";
import type { NextRequest } from "next/server";
import { authOptions } from "@/lib/auth/options";

type Ctx = { params: Promise<{ nextauth: string[] }> };

async function handler(req: NextRequest, ctx: Ctx) {
  return NextAuth(req, { params: await ctx.params }, authOptions());
}

export { handler as GET, handler as POST };
