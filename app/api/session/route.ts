import { ROLE_HOME } from "@/lib/server/core/access";
import { open, readJson } from "@/lib/server/core/route";
import { clearSessionCookieHeader, sealSession, sessionCookieHeader } from "@/lib/server/core/session";
import { signIn } from "@/lib/server/users/sign-in";
import { signInSchema } from "@/lib/schemas/session";

function clientAddress(req: Request): string {
  return req.headers.get("x-forwarded-for")?.split(",")[0]?.trim() || req.headers.get("x-real-ip") || "local";
}

/** Sign in: sets the sealed session cookie and says where this role's home is. */
export const POST = open(async ({ req }) => {
  const input = await readJson(req, signInSchema);
  const user = await signIn(input.email, input.password, clientAddress(req));
  const sealed = await sealSession({
    userId: user.id,
    shopId: user.shopId,
    role: user.role,
    name: user.name,
    issuedAt: Date.now(),
  });
  return Response.json(
    { user: { id: user.id, name: user.name, role: user.role }, home: ROLE_HOME[user.role] },
    { headers: { "Set-Cookie": sessionCookieHeader(sealed) } },
  );
});

/** Sign out. */
export const DELETE = open(
  async () => new Response(null, { status: 204, headers: { "Set-Cookie": clearSessionCookieHeader() } }),
);
