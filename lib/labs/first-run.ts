// The first-run path of a new lab: what its overview asks the manager to do next, in order.
// Pure: built from counts the database reports (db/queries/first-run.ts).
import { count, withArticle, type Forms } from "@/lib/format/plural";

/** 1.50 to 5.00 mm in 0.25 mm steps: diameters only; pressures are the manager's to enter. */
export const LADDER_FROM_MM = 1.5;
export const LADDER_TO_MM = 5;
export const LADDER_STEP_MM = 0.25;
export const SIZE_LADDER: readonly number[] = Array.from(
  { length: Math.round((LADDER_TO_MM - LADDER_FROM_MM) / LADDER_STEP_MM) + 1 },
  (_, i) => Number((LADDER_FROM_MM + i * LADDER_STEP_MM).toFixed(2)),
);

export type FirstRunStatus = {
  familiesWithStock: number;
  sizesInStock: number;
  members: { lead: number; educator: number };
  invited: { lead: number; educator: number };
  charts: number;
  approvedEditions: number;
};

export type FirstRunStep = {
  key: "stock" | "lead" | "educator" | "chart" | "approved";
  title: string;
  done: boolean;
  /** What is there, or what is missing, in one sentence. */
  state: string;
  links: { href: string; label: string }[];
};

const plural = (n: number, one: string, other = `${one}s`) => count(n, { one, other });

export function firstRunSteps(slug: string, s: FirstRunStatus): FirstRunStep[] {
  const lab = `/labs/${slug}`;
  const person = (role: "lead" | "educator", noun: Forms, why: string): FirstRunStep => ({
    key: role,
    title: `Invite ${withArticle(noun.one)}`,
    done: s.members[role] > 0,
    state:
      s.members[role] > 0
        ? `${count(s.members[role], noun)} in the lab.`
        : s.invited[role] > 0
          ? `Invited, waiting for them to accept (${why}).`
          : `No ${noun.one} yet: ${why}.`,
    // The invitation form opens with the role the step names.
    links: [
      s.invited[role] > 0
        ? { href: `${lab}/members`, label: "See the invitation" }
        : { href: `${lab}/members?role=${role}#invite-heading`, label: `Invite ${withArticle(noun.one)}` },
    ],
  });
  return [
    {
      key: "stock",
      title: "Record your balloon stock",
      done: s.sizesInStock > 0,
      state:
        s.sizesInStock > 0
          ? `${plural(s.sizesInStock, "balloon size")} in stock in ${plural(s.familiesWithStock, "family", "families")}.`
          : "No balloon sizes in stock yet: charts are built only from sizes on your shelf, with the pressures you enter.",
      links: [
        { href: `${lab}/stock#stock-import-heading`, label: "Import a CSV file" },
        { href: `${lab}/stock/ladder`, label: "Start from a generic size ladder (1.50-5.00 mm)" },
      ],
    },
    person(
      "lead",
      { one: "medical lead", other: "medical leads" },
      "the medical lead approves every chart before it is printed",
    ),
    person("educator", { one: "educator", other: "educators" }, "educators design the charts"),
    {
      key: "chart",
      title: "Design a first chart from a template",
      done: s.charts > 0,
      state:
        s.charts > 0
          ? `${plural(s.charts, "chart")} designed.`
          : s.sizesInStock > 0
            ? "No chart yet. A template's axes start at your stocked range."
            : "No chart yet; record stock first so the template's axes fit your shelf.",
      links: [
        { href: `${lab}/charts/new?template=pot`, label: "POT chart" },
        { href: `${lab}/charts/new?template=kissing`, label: "Kissing-balloon chart" },
      ],
    },
    {
      key: "approved",
      title: "Get it approved and print it",
      done: s.approvedEditions > 0,
      state:
        s.approvedEditions > 0
          ? `${plural(s.approvedEditions, "approved edition")}: download the poster from its chart.`
          : "Nothing approved yet: create an edition on the chart; the medical lead reviews and approves it, then its PDF can be downloaded.",
      links: [{ href: `${lab}#charts-h`, label: "Your charts" }],
    },
  ];
}
