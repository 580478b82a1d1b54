import { InvitationsTable } from "@/components/members/invitations-table";
import { InviteForm } from "@/components/members/invite-form";
import { count } from "@/lib/format/plural";
import { ROLES } from "@/lib/permissions";
import { MembersTable } from "@/components/members/members-table";
import { Forbidden } from "@/components/ui/forbidden";
import { listInvitations, listMembers } from "@/lib/ops/members";
import { memberForPage } from "@/lib/auth/page-guard";

export const metadata = { title: "Members" };

export default async function MembersPage({
  params,
  searchParams,
}: {
  params: Promise<{ slug: string }>;
  searchParams: Promise<{ role?: string }>;
}) {
  const { slug } = await params;
  const asked = (await searchParams).role;
  const role = ROLES.find((r) => r === asked);
  const member = await memberForPage(slug, "members:manage", `/labs/${slug}/members`);
  if (member === "forbidden") return <Forbidden what="manage the lab's members" slug={slug} />;
  const [members, { invitations }] = await Promise.all([
    listMembers(member.caller, { lab: slug }),
    listInvitations(member.caller, { lab: slug }),
  ]);
  return (
    <div className="space-y-10">
      <section aria-labelledby="members-heading">
        <div className="mb-3 flex flex-wrap items-baseline justify-between gap-2">
          <h1 id="members-heading" className="text-xl font-bold">
            Members
          </h1>
          <p className="text-sm text-ink-faint">
            {count(members.length, { one: "person", other: "people" })}; a lab always keeps at least one manager.
          </p>
        </div>
        <MembersTable slug={slug} members={members} meUserId={member.user.id} timeZone={member.lab.timeZone} />
      </section>

      <section aria-labelledby="invite-heading" className="rounded-card border border-line bg-paper-raised p-5">
        <h2 id="invite-heading" className="mb-1 text-lg font-semibold">
          Invite a person
        </h2>
        <p className="mb-4 text-sm text-ink-soft">
          They receive an e-mail with a link that works once and expires after 72 hours.
        </p>
        <InviteForm slug={slug} initialRole={role} />
      </section>

      <section aria-labelledby="invitations-heading">
        <h2 id="invitations-heading" className="mb-3 text-lg font-semibold">
          Open invitations
        </h2>
        <InvitationsTable slug={slug} invitations={invitations} timeZone={member.lab.timeZone} />
      </section>
    </div>
  );
}
