export const fieldClass = "mt-1 w-full rounded-md border border-line-strong bg-white px-3 py-2 disabled:bg-paper-sunk";
export const labelClass = "block text-sm font-medium";
export const num = { valueAsNumber: true } as const;
