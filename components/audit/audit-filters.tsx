import Link from "next/link";
import { buttonClass } from "@/components/ui/button";
import { inputClass } from "@/components/ui/field";
import { AUDIT_KIND_IDS, AUDIT_KINDS, type AuditKind } from "@/lib/audit/describe";

/** A plain GET form: works before JavaScript loads, and every filter stays in the address. */
export function AuditFilters({
  action,
  values,
  people,
  timeZone,
}: {
  action: string;
  /** The lab's zone: the dates are its calendar days. */
  timeZone: string;
  values: { kind?: AuditKind; actor?: number; from?: string; to?: string };
  people: { id: number; name: string; email: string }[];
}) {
  return (
    <form method="get" action={action} aria-label="Filter the audit log" className="rounded-md border border-line p-3">
      <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-4">
        <div>
          <label htmlFor="audit-kind" className="block text-sm font-medium">
            Kind of event
          </label>
          <select id="audit-kind" name="kind" defaultValue={values.kind ?? ""} className={inputClass}>
            <option value="">Any kind</option>
            {AUDIT_KIND_IDS.map((k) => (
              <option key={k} value={k}>
                {AUDIT_KINDS[k].label}
              </option>
            ))}
          </select>
        </div>
        <div>
          <label htmlFor="audit-actor" className="block text-sm font-medium">
            Person
          </label>
          <select
            id="audit-actor"
            name="actor"
            defaultValue={values.actor ? String(values.actor) : ""}
            className={inputClass}
          >
            <option value="">Anyone</option>
            {people.map((p) => (
              <option key={p.id} value={p.id}>
                {p.name} ({p.email})
              </option>
            ))}
          </select>
        </div>
        <div>
          <label htmlFor="audit-from" className="block text-sm font-medium">
            From (date in {timeZone})
          </label>
          <input id="audit-from" name="from" type="date" defaultValue={values.from ?? ""} className={inputClass} />
        </div>
        <div>
          <label htmlFor="audit-to" className="block text-sm font-medium">
            To (date in {timeZone}, inclusive)
          </label>
          <input id="audit-to" name="to" type="date" defaultValue={values.to ?? ""} className={inputClass} />
        </div>
      </div>
      <div className="mt-3 flex flex-wrap gap-3">
        <button type="submit" className={buttonClass("primary")}>
          Show
        </button>
        <Link href={action} className={buttonClass("secondary")}>
          Clear filters
        </Link>
      </div>
    </form>
  );
}
