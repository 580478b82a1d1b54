import { AppError } from "@/lib/errors";

/** The AppError a refused call throws; anything else (success, or another error) fails the test. */
export async function refusal(promise: Promise<unknown>): Promise<AppError> {
  try {
    await promise;
  } catch (err) {
    if (err instanceof AppError) return err;
    throw err;
  }
  throw new Error("expected a refusal (an AppError), but the call succeeded");
}
