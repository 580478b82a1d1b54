import type { FieldValues, Path, UseFormSetError } from "react-hook-form";
import { StockApiError } from "./stock-api";

/** Puts the server's per-field reasons on the fields and the rest in the form's own message. */
export function showServerError<T extends FieldValues>(
  err: unknown,
  setError: UseFormSetError<T>,
  fields: readonly string[],
) {
  const api =
    err instanceof StockApiError
      ? err
      : new StockApiError("Something went wrong. Please try again; nothing was changed.", 0);
  for (const issue of api.issues) {
    const key = String(issue.path[0] ?? "");
    if (fields.includes(key)) setError(key as Path<T>, { type: "server", message: issue.message });
  }
  setError("root.server" as Path<T>, { type: "server", message: api.message });
}
