// The admin's copy of everything the shop has recorded, as one download (format: docs/archive-format.md).
export function ShopArchive() {
  return (
    <section className="rounded-tool border-2 border-rule bg-panel p-4" aria-labelledby="shop-archive-title">
      <h2 id="shop-archive-title" className="mb-2 text-xl font-semibold">
        The shop&apos;s data
      </h2>
      <p className="mb-3 max-w-prose text-muted">
        One zip file with every job, reading, flag and decision, release, gauge and gauge study and audit event of this
        shop, as CSV files a spreadsheet opens and JSON. It is yours to keep: it holds customers&apos; names and
        addresses, so store it as carefully as the records themselves. The download is noted in the audit trail.
      </p>
      <a
        className={
          "inline-flex min-h-11 items-center rounded-tool border-2 border-steel px-4 font-medium text-steel " +
          "underline-offset-2 hover:underline"
        }
        href="/api/admin/archive"
        download
      >
        Download all of the shop&apos;s data (zip)
      </a>
    </section>
  );
}
