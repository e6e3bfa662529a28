import { customerSchema } from "@/lib/schemas/job";
import { createCustomer, listCustomers } from "@/lib/server/job-edit/repo";
import { authed, readJson } from "@/lib/server/core/route";

export const GET = authed(["lead", "admin"], async ({ actor }) => ({ customers: await listCustomers(actor.shopId) }));

export const POST = authed(["lead"], async ({ req, actor }) => {
  const values = await readJson(req, customerSchema);
  return Response.json({ customer: await createCustomer(actor, values) }, { status: 201 });
});
