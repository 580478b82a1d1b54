import { TextField } from "@/components/ui/field";
import { PASSWORD_MIN } from "@/lib/validation/password-rules";

export function NewPasswordFields({ errors }: { errors?: Record<string, string> }) {
  return (
    <>
      <TextField
        label="New password"
        name="password"
        type="password"
        autoComplete="new-password"
        required
        minLength={PASSWORD_MIN}
        hint={`At least ${PASSWORD_MIN} characters; a short phrase is easier to remember than symbols.`}
        error={errors?.password}
      />
      <TextField
        label="Repeat the password"
        name="confirm"
        type="password"
        autoComplete="new-password"
        required
        error={errors?.confirm}
      />
    </>
  );
}
