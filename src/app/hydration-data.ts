import type { DehydratedState } from '@tanstack/react-query';

/** The id of the JSON script tag that carries server state to the client (no inline script: CSP). */
export const HYDRATION_SCRIPT_ID = 'rr-hydration';

export interface HydrationPayload {
  router: {
    loaderData: Record<string, unknown>;
    actionData: Record<string, unknown> | null;
    errors: Record<string, unknown> | null;
  };
  query: DehydratedState;
  /** The site's public address, so canonical and share links match on the server and in the browser. */
  site: { publicUrl: string };
}

/** Serialises the payload so it is safe inside a <script type="application/json"> element. */
export function serializeHydration(payload: HydrationPayload): string {
  return JSON.stringify(payload)
    .replace(/</g, '\\u003c')
    .replace(/>/g, '\\u003e')
    .replace(/&/g, '\\u0026')
    .replace(/\u2028/g, '\\u2028')
    .replace(/\u2029/g, '\\u2029');
}

/** Route errors as React Router's browser router expects to find them when hydrating. */
export function serializeRouteErrors(errors: Record<string, unknown> | null): Record<string, unknown> | null {
  if (!errors) return null;
  const out: Record<string, unknown> = {};
  for (const [id, err] of Object.entries(errors)) {
    if (err && typeof err === 'object' && 'status' in err && 'statusText' in err && 'internal' in err) {
      out[id] = { ...(err as object), __type: 'RouteErrorResponse' };
    } else if (err instanceof Error) {
      // Never ship a stack trace to the client.
      out[id] = { message: 'Something went wrong', __type: 'Error' };
    } else {
      out[id] = err;
    }
  }
  return out;
}
