import NextAuth from "next-auth";
import { authOptions } from "@/lib/server/auth/options";

function handler(request: Request, context: { params: Promise<{ nextauth: string[] }> }) {
  return NextAuth(authOptions())(request, context);
}

export { handler as GET, handler as POST };
