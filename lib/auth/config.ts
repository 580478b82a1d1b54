import NextAuth, { CredentialsSignin } from "next-auth";
import Credentials from "next-auth/providers/credentials";
import { z } from "zod";
import { signOutEverywhere } from "@/db/queries/sessions";
import { env } from "@/lib/env";
import { secureCookies } from "./cookies";
import { PASSWORD_MAX } from "./password";
import { verifySignIn } from "./sign-in";
import { log } from "@/lib/log";
import { addressOf } from "./request-address";

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
  // Secure (and __Secure-/__Host- prefixed) cookies whenever the app is served over https,
  // whatever protocol a proxy reports on a given request.
  useSecureCookies: secureCookies(env.APP_URL),
  secret: env.AUTH_SECRET,
  session: { strategy: "jwt", maxAge: 12 * 60 * 60 },
  pages: { signIn: "/sign-in" },
  // A wrong password is an expected outcome (answered on the form and audited), not a server error.
  logger: {
    error(error) {
      if (error instanceof CredentialsSignin || (error as { type?: string }).type === "CredentialsSignin") return;
      log.error({ err: error }, "auth error");
    },
  },
  providers: [
    Credentials({
      credentials: { email: { label: "E-mail" }, password: { label: "Password", type: "password" } },
      async authorize(raw, request) {
        const parsed = credentials.safeParse(raw);
        if (!parsed.success) return null;
        const result = await verifySignIn({ ...parsed.data, ip: addressOf(request.headers) });
        if (!result.ok) {
          if (result.reason === "throttled") throw new ThrottledSignin();
          return null;
        }
        return {
          id: String(result.user.id),
          email: result.user.email,
          name: result.user.name,
          sessionVersion: result.user.sessionVersion,
        };
      },
    }),
  ],
  events: {
    // Any sign-out (the page's button or next-auth's own endpoint) ends every session of the
    // person: a copied cookie stops working too.
    async signOut(message) {
      const id = Number("token" in message ? message.token?.sub : undefined);
      if (Number.isSafeInteger(id) && id > 0) await signOutEverywhere({ userId: id });
    },
  },
  callbacks: {
    jwt({ token, user }) {
      if (user?.id) {
        token.sub = user.id;
        token.sv = (user as { sessionVersion?: number }).sessionVersion ?? 0;
      }
      return token;
    },
    session({ session, token }) {
      if (token.sub) session.user.id = token.sub;
      // Compared with users.session_version on every request (lib/auth/session.ts).
      return Object.assign(session, { sessionVersion: typeof token.sv === "number" ? token.sv : 0 });
    },
  },
});
