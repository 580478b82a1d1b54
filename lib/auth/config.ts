import NextAuth, { CredentialsSignin } from "next-auth";
import Credentials from "next-auth/providers/credentials";
import { z } from "zod";
import { findUserByEmail } from "@/db/queries/members";
import { env } from "@/lib/env";
import { PASSWORD_MAX, verifyPassword } from "./password";

const credentials = z.object({
  email: z.email().max(254),
  password: z.string().min(1).max(PASSWORD_MAX),
});

export class ThrottledSignin extends CredentialsSignin {
  code = "throttled";
}

// Sessions are signed JWT cookies (AUTH_SECRET from .env.local), so they survive a restart.
export const { handlers, auth, signIn, signOut } = NextAuth({
  trustHost: true,
  secret: env.AUTH_SECRET,
  session: { strategy: "jwt", maxAge: 12 * 60 * 60 },
  pages: { signIn: "/sign-in" },
  providers: [
    Credentials({
      credentials: { email: { label: "E-mail" }, password: { label: "Password", type: "password" } },
      async authorize(raw) {
        const parsed = credentials.safeParse(raw);
        if (!parsed.success) return null;
        const user = await findUserByEmail({ email: parsed.data.email });
        if (!user || !(await verifyPassword(parsed.data.password, user.passwordHash))) return null;
        return { id: String(user.id), email: user.email, name: user.name };
      },
    }),
  ],
  callbacks: {
    jwt({ token, user }) {
      if (user?.id) token.sub = user.id;
      return token;
    },
    session({ session, token }) {
      if (token.sub) session.user.id = token.sub;
      return session;
    },
  },
});
