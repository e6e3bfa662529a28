import "server-only";
import type { ZodType } from "zod";
import { requireActor } from "@/lib/server/core/access";
import type { Actor } from "@/lib/schemas/session";
import { AppError, errorResponse, invalid } from "@/lib/server/core/errors";
import { requireOwnOrigin } from "@/lib/server/core/origin";
import type { Role } from "@/lib/schemas/enums";

// Wrap handlers once instead of repeating try/catch. Every route goes through one of these two, so
// every state-changing request meets the origin check before anything else (tests/api/origin.test.ts
// finds a route that does not).
type RouteContext<P> = { params: Promise<P> };
type Handler<P> = (ctx: { req: Request; actor: Actor; params: P }) => Promise<Response | unknown>;
type PublicHandler<P> = (ctx: { req: Request; params: P }) => Promise<Response | unknown>;

function toResponse(result: unknown): Response {
  if (result instanceof Response) return result;
  if (result === undefined) return new Response(null, { status: 204 });
  return Response.json(result);
}

/** `opts.whilePasswordMustChange`: the route stays open to someone who owes a password change. */
export function authed<P = Record<string, string>>(
  roles: readonly Role[] | "any",
  fn: Handler<P>,
  opts: { whilePasswordMustChange?: boolean } = {},
) {
  return async (req: Request, ctx?: RouteContext<P>): Promise<Response> => {
    try {
      requireOwnOrigin(req);
      const actor = await requireActor(req, roles, opts);
      const params = ((await ctx?.params) ?? {}) as P;
      return toResponse(await fn({ req, actor, params }));
    } catch (err) {
      return errorResponse(err);
    }
  };
}

export function open<P = Record<string, string>>(fn: PublicHandler<P>) {
  return async (req: Request, ctx?: RouteContext<P>): Promise<Response> => {
    try {
      requireOwnOrigin(req);
      const params = ((await ctx?.params) ?? {}) as P;
      return toResponse(await fn({ req, params }));
    } catch (err) {
      return errorResponse(err);
    }
  };
}

// application/json, with or without parameters (charset). A text/plain body is what a page on any
// site can send without asking first, so it is refused rather than parsed.
const JSON_TYPE = /^application\/json\s*(;|$)/i;

/** 415 unless the body is declared JSON, 400 on JSON that does not parse, 422 when the schema refuses it. */
export async function readJson<T>(req: Request, schema: ZodType<T>): Promise<T> {
  const type = req.headers.get("content-type");
  if (!JSON_TYPE.test(type ?? "")) {
    throw new AppError(
      "unsupported_media",
      `Send the body as JSON with the header Content-Type: application/json (this request said ${type || "nothing"})`,
    );
  }
  let body: unknown;
  try {
    body = await req.json();
  } catch {
    throw new AppError("bad_json", "The request body is not valid JSON");
  }
  const parsed = schema.safeParse(body);
  if (!parsed.success) throw invalid(parsed.error);
  return parsed.data;
}

export function parseId(raw: string | undefined, what = "Record"): number {
  const n = Number(raw);
  if (!Number.isInteger(n) || n <= 0) throw new AppError("not_found", `${what} not found`);
  return n;
}
