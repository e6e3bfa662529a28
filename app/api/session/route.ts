import { clientAddress } from "@/lib/server/core/client-address";
import { homeFor } from "@/lib/server/core/access";
import { open, readJson } from "@/lib/server/core/route";
import { sessionCookieHeader, sessionFromRequest } from "@/lib/server/core/session";
import { closeSession, openSession } from "@/lib/server/sessions/lifecycle";
import { signIn } from "@/lib/server/users/sign-in";
import { signInSchema, signOutSchema } from "@/lib/schemas/session";

/**
 * Sign in: sets the sealed session cookie and says where this role's home is. A session this browser
 * still carried (someone who signed out offline on a shared tablet) ends here, so none lingers.
 */
export const POST = open(async ({ req }) => {
  const input = await readJson(req, signInSchema);
  const user = await signIn(input.email, input.password, clientAddress(req));
  const session = await openSession(user, await sessionFromRequest(req));
  return Response.json(
    {
      user: { id: user.id, name: user.name, role: user.role },
      sessionId: session.sessionId,
      home: homeFor(user),
      mustChangePassword: user.mustChangePassword,
    },
    { headers: { "Set-Cookie": sessionCookieHeader(session.cookie) } },
  );
});

/** Sign out: ends the session on the server (see closeSession for a session named in the body). */
export const DELETE = open(async ({ req }) => {
  const hasBody = req.headers.get("content-type")?.includes("json") ?? false;
  const { sessionId } = hasBody ? await readJson(req, signOutSchema) : {};
  const cookie = await closeSession(await sessionFromRequest(req), sessionId);
  return new Response(null, { status: 204, headers: cookie ? { "Set-Cookie": cookie } : {} });
});
