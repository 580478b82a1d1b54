/** Whether session and CSRF cookies must be Secure: whenever APP_URL is https (finding 14). */
export function secureCookies(appUrl: string): boolean {
  return new URL(appUrl).protocol === "https:";
}
