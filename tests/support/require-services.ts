// Integration and browser tests need the throwaway MariaDB, fakes and app that `npm test` starts.
export default function requireServices() {
  if (!process.env.DATABASE_URL || !process.env.TW_BASE_URL) {
    throw new Error(
      "Integration and browser tests run through `npm test`, which starts MariaDB, the fakes and the app.",
    );
  }
}
