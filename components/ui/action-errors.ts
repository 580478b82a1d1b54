import type { FieldValues, Path, UseFormSetError } from "react-hook-form";
import type { ActionState } from "@/lib/http/action";

/**
 * The one reader of a refused action on the client: each field's reason goes on its field (of
 * those the form shows), the message into the form's own alert (`root.server`).
 */
export function showActionErrors<T extends FieldValues>(
  state: ActionState,
  setError: UseFormSetError<T>,
  fields: readonly string[],
) {
  for (const [key, message] of Object.entries(state.fieldErrors ?? {}))
    if (fields.includes(key)) setError(key as Path<T>, { type: "server", message });
  setError("root.server" as Path<T>, {
    type: "server",
    message: state.message ?? "Something went wrong. Please try again; nothing was changed.",
  });
}
