import "server-only";
import type { ZodType } from "zod";
import { requireActor } from "@/lib/server/core/access";
import type { Actor } from "@/lib/schemas/session";
import { AppError, errorResponse, invalid } from "@/lib/server/core/errors";
import type { Role } from "@/lib/schemas/enums";

// Wrap handlers once instead of repeating try/catch.
type RouteContext<P> = { params: Promise<P> };
type Handler<P> = (ctx: { req: Request; actor: Actor; params: P }) => Promise<Response | unknown>;
type PublicHandler<P> = (ctx: { req: Request; params: P }) => Promise<Response | unknown>;

function toResponse(result: unknown): Response {
  if (result instanceof Response) return result;
  if (result === undefined) return new Response(null, { status: 204 });
  return Response.json(result);
}

export function authed<P = Record<string, string>>(roles: readonly Role[] | "any", fn: Handler<P>) {
  return async (req: Request, ctx?: RouteContext<P>): Promise<Response> => {
    try {
      const actor = await requireActor(req, roles);
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
      const params = ((await ctx?.params) ?? {}) as P;
      return toResponse(await fn({ req, params }));
    } catch (err) {
      return errorResponse(err);
    }
  };
}

/** 400 on JSON that does not parse, 422 with field errors when the schema refuses it. */
export async function readJson<T>(req: Request, schema: ZodType<T>): Promise<T> {
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
