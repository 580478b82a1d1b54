import { redirect } from "next/navigation";
import { NewLabForm } from "@/components/labs/new-lab-form";
import { currentUser } from "@/lib/auth/session";
import { env } from "@/lib/env";
import { needsVerification } from "@/lib/ops/sign-up";

export const metadata = { title: "Create a lab" };

export default async function NewLabPage() {
  const user = await currentUser();
  if (!user) redirect("/sign-in?callbackUrl=/labs/new");
  if (await needsVerification({ kind: "user", user })) redirect("/check-email");
  return (
    <div>
      <h1 className="text-2xl font-bold">Create a lab</h1>
      <p className="mt-1 max-w-prose text-ink-soft">
        You become the lab&apos;s manager. Next, its overview walks you through the stock, the team (a medical lead to
        approve charts, an educator to design them) and a first chart.
      </p>
      <NewLabForm origin={env.APP_URL} />
    </div>
  );
}
