/** The schema owner's address when the environment names one (npm test, bench:scale), else the app's. */
export function ownerUrl(): string {
  const u = new URL(process.env.DATABASE_URL!);
  if (process.env.DB_OWNER_USER) {
    u.username = encodeURIComponent(process.env.DB_OWNER_USER);
    u.password = encodeURIComponent(process.env.DB_OWNER_PASSWORD ?? "");
  }
  return u.toString();
}
