import { SettingsForm } from "@/components/settings/settings-form";
import { TokensPanel } from "@/components/settings/tokens-panel";
import { memberForPage } from "@/lib/auth/page-guard";
import { getLabSettings } from "@/lib/ops/lab-settings";
import { listTokens } from "@/lib/ops/tokens";
import { can } from "@/lib/permissions";

export const metadata = { title: "Settings" };

const NUMBER_FORMAT_LABEL = { point: "Decimal point (3.25 mm)", comma: "Decimal comma (3,25 mm)" } as const;

export default async function SettingsPage({ params }: { params: Promise<{ slug: string }> }) {
  const { slug } = await params;
  const member = await memberForPage(slug, "lab:read", `/labs/${slug}/settings`);
  if (member === "forbidden") return null;
  const settings = await getLabSettings(member.caller, { lab: slug });
  const manager = can(member.role, "settings:manage");
  const tokens = can(member.role, "tokens:manage") ? (await listTokens(member.caller, { lab: slug })).tokens : null;
  return (
    <div className="max-w-2xl space-y-10">
      <section aria-labelledby="settings-heading">
        <h1 id="settings-heading" className="mb-1 text-xl font-bold">
          Lab settings
        </h1>
        {settings.isDemo ? (
          <p className="mb-4 text-sm text-ink-soft">
            This is a demo lab: its data is invented and illustrative, and its posters say so.
          </p>
        ) : null}
        {manager ? (
          <SettingsForm slug={slug} settings={settings} zones={Intl.supportedValuesOf("timeZone")} />
        ) : (
          <dl className="grid gap-x-6 gap-y-2 sm:grid-cols-[12rem_1fr]">
            <dt className="font-medium">Lab name</dt>
            <dd>{settings.name}</dd>
            <dt className="font-medium">Time zone</dt>
            <dd>{settings.timeZone}</dd>
            <dt className="font-medium">Numbers on posters</dt>
            <dd>{NUMBER_FORMAT_LABEL[settings.numberFormat]}</dd>
            <dt className="font-medium">Contact line</dt>
            <dd>{settings.contactLine ?? "None"}</dd>
            <dd className="text-sm text-ink-faint sm:col-span-2">Only the lab&apos;s managers change these.</dd>
          </dl>
        )}
      </section>
      {tokens ? (
        <section aria-labelledby="tokens-heading">
          <h2 id="tokens-heading" className="mb-1 text-lg font-semibold">
            Machine tokens
          </h2>
          <p className="mb-4 text-sm text-ink-soft">
            A token lets the lab&apos;s inventory system read or change the stock through the API (
            <code>Authorization: Bearer …</code>) without a person signing in. It works only for this lab&apos;s stock;
            its changes make posted copies outdated and send the same e-mails as a person&apos;s.
          </p>
          <TokensPanel slug={slug} tokens={tokens} timeZone={settings.timeZone} />
        </section>
      ) : null}
    </div>
  );
}
