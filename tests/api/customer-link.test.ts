// The customer's signed, expiring link: it opens one record and its PDF, expires, refuses any
// change, and grants nothing else (on the API it is just an unknown credential: 401).
import { describe, expect, it } from "vitest";
import { GET as customerPdf } from "@/app/api/r/[token]/pdf/route";
import { GET as me } from "@/app/api/me/route";
import { GET as recordPdf } from "@/app/api/record/[jobId]/pdf/route";
import { GET as attachment } from "@/app/api/attachments/[id]/route";
import { GET as releaseView } from "@/app/api/release/[jobId]/route";
import { checkCustomerToken, createCustomerToken } from "@/lib/server/release/customer-link";
import { customerView } from "@/lib/server/release/customer-view";
import { pdfText } from "../support/pdf-text";
import { createRecordJob } from "../support/record-fixtures";
import { asOwner } from "../support/owner-db";

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

async function download(token: string) {
  const req = new Request(`http://localhost/api/r/${token}/pdf`);
  const res = await customerPdf(req, { params: Promise.resolve({ token }) });
  return {
    status: res.status,
    location: res.headers.get("location"),
    type: res.headers.get("content-type"),
    disposition: res.headers.get("content-disposition"),
    bytes: Buffer.from(await res.arrayBuffer()),
  };
}

describe("customer record links", () => {
  it("open the one released record and its PDF without an account", async () => {
    const job = await createRecordJob({ photo: false });
    const token = createCustomerToken(job.release!.id);
    const view = await customerView(token);
    expect(view.status).toBe("ok");
    if (view.status !== "ok") return;
    expect(view.record.job.code).toBe(job.job.code);
    expect(view.record.release!.hash).toBe(job.release!.hash);
    const res = await download(token);
    expect(res.status).toBe(200);
    expect(res.type).toBe("application/pdf");
    expect(res.disposition).toBe(`attachment; filename="build-record-${job.job.code}.pdf"`);
    expect((await pdfText(res.bytes)).text).toContain(job.release!.hash);
  });

  it("expire after their lifetime and then name the shop to ask", async () => {
    const job = await createRecordJob({ photo: false });
    await asOwner("UPDATE shops SET phone = ?, email = ? WHERE id = ?", ["555-0199", "desk@test.example", job.shop.id]);
    const token = createCustomerToken(job.release!.id, { ttlSeconds: 1 });
    expect(checkCustomerToken(token).ok).toBe(true);
    await sleep(1100);
    const check = checkCustomerToken(token);
    expect(check).toMatchObject({ ok: false, reason: "expired", releaseId: job.release!.id });
    const view = await customerView(token);
    expect(view).toMatchObject({
      status: "expired",
      shop: { name: job.shop.name, phone: "555-0199", email: "desk@test.example" },
    });
    const res = await download(token);
    expect(res.status).toBe(303);
    expect(new URL(res.location!).pathname).toBe(`/r/${token}`);
  });

  it("refuse any change: another release id, expiry or signature, or junk", async () => {
    const job = await createRecordJob({ photo: false });
    const token = createCustomerToken(job.release!.id);
    const [v, id, exp, sig] = token.split(".");
    const tampered = [
      [v, String(Number(id) + 1), exp, sig].join("."),
      [v, id, String(Number(exp) + 86_400), sig].join("."),
      [v, id, exp, `${sig.slice(0, -2)}AA`].join("."),
      [v, id, exp].join("."),
      "",
      "r1.1.1.x",
      "../../etc/passwd",
    ];
    for (const t of tampered) {
      expect(checkCustomerToken(t)).toEqual({ ok: false, reason: "invalid" });
      expect((await customerView(t)).status).toBe("invalid");
    }
    expect((await download(tampered[0])).status).toBe(303);
  });

  it("grant no access to the API, as a cookie, a bearer token or a query", async () => {
    const job = await createRecordJob();
    const token = createCustomerToken(job.release!.id);
    const jobId = String(job.job.id);
    const ways: Record<string, string>[] = [
      { cookie: `tw_session=${token}` },
      { authorization: `Bearer ${token}` },
      {},
    ];
    for (const headers of ways) {
      const q = `?token=${token}`;
      const ctx = <P>(p: P) => ({ params: Promise.resolve(p) });
      expect((await me(new Request(`http://localhost/api/me${q}`, { headers }), ctx({}))).status).toBe(401);
      expect(
        (await recordPdf(new Request(`http://localhost/api/record/${jobId}/pdf${q}`, { headers }), ctx({ jobId })))
          .status,
      ).toBe(401);
      expect(
        (await releaseView(new Request(`http://localhost/api/release/${jobId}${q}`, { headers }), ctx({ jobId })))
          .status,
      ).toBe(401);
      expect(
        (
          await attachment(
            new Request(`http://localhost/api/attachments/${job.photoId}${q}`, { headers }),
            ctx({ id: job.photoId! }),
          )
        ).status,
      ).toBe(401);
    }
  });
});
