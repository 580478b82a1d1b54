import bcrypt from "bcryptjs";

// bcrypt (Provos & Mazieres, USENIX 1999); cost 11 keeps sign-in near 150 ms in pure JS.
const COST = 11;
export { PASSWORD_MAX, PASSWORD_MIN } from "@/lib/validation/password-rules";

export function hashPassword(plain: string): Promise<string> {
  return bcrypt.hash(plain, COST);
}

export function verifyPassword(plain: string, hash: string): Promise<boolean> {
  return bcrypt.compare(plain, hash);
}
