import { after } from "next/server";
import { addressOf } from "@/lib/auth/request-address";
import { api } from "@/lib/http/route";
import { log } from "@/lib/log";
import { admitSignUp, completeSignUp } from "@/lib/ops/sign-up";

// 202 whether or not the address already has an account: the work (and its e-mail) happens
// after the answer, so neither the body nor the timing says which.
export const POST = api(
  async ({ req, body }) => {
    const ip = addressOf(req.headers);
    const input = await admitSignUp(await body(), { ip });
    after(() =>
      completeSignUp(input, { ip }).catch((err: unknown) =>
        log.error({ err, operation: "account.sign_up" }, "sign-up failed"),
      ),
    );
    return {
      status: "accepted",
      message: `If ${input.email} can be used, a link to confirm it is on its way. Open it to finish creating the account.`,
    };
  },
  { status: 202, public: true },
);
