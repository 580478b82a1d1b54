// Shared by the server and the forms (no bcrypt here, so the browser bundle stays small).
export const PASSWORD_MIN = 10;
export const PASSWORD_MAX = 72; // bcrypt reads at most 72 bytes
