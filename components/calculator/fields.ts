export type Target = "parent" | "mb" | "sb";
export type LawOption = { id: string; name: string; formula: string; source: string };

export const FIELDS: { key: Target; label: string; hint: string }[] = [
  { key: "parent", label: "Parent (proximal main vessel)", hint: "Dp" },
  { key: "mb", label: "Main branch", hint: "Dmb" },
  { key: "sb", label: "Side branch", hint: "Dsb" },
];
export const field = (key: Target) => FIELDS.find((f) => f.key === key)!;

export const INPUT_CLASS =
  "mt-1 min-h-11 w-full rounded-md border border-line-strong bg-white px-3 py-2 text-lg tabular-nums";
