import { apiErrorBodySchema } from '@shared/api/schemas'
import type { z } from 'zod'

/** An API call that failed: HTTP status, server error code, message and the fields at fault. */
export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields: { path: string; message: string }[] = [],
  ) {
    super(message)
  }
  /** The message for one field, for showing beside a form input. */
  fieldMessage(path: string): string | undefined {
    return this.fields.find((f) => f.path === path)?.message
  }
}

type UnauthorizedListener = () => void
let onUnauthorized: UnauthorizedListener = () => {}
/** The auth store registers what a 401 means (sign the user out locally). */
export function setUnauthorizedListener(listener: UnauthorizedListener) {
  onUnauthorized = listener
}

interface RequestOptions {
  method?: 'GET' | 'POST' | 'PATCH' | 'PUT' | 'DELETE'
  body?: unknown
  /** Do not treat 401 as "signed out" (the sign-in call itself). */
  quiet401?: boolean
}

/** Sends a JSON request with the session cookie and parses the answer with `schema`. */
export async function request<S extends z.ZodType>(
  path: string,
  schema: S,
  options: RequestOptions = {},
): Promise<z.infer<S>> {
  const res = await send(path, options)
  if (res.status === 204) return schema.parse(undefined)
  return schema.parse(await res.json())
}

/** Same as `request` for calls whose answer carries no body. */
export async function requestVoid(path: string, options: RequestOptions = {}): Promise<void> {
  await send(path, options)
}

async function send(path: string, { method = 'GET', body, quiet401 }: RequestOptions) {
  let res: Response
  try {
    res = await fetch(`/api${path}`, {
      method,
      credentials: 'include',
      headers: body === undefined ? {} : { 'Content-Type': 'application/json' },
      body: body === undefined ? undefined : JSON.stringify(body),
    })
  } catch {
    throw new ApiError(0, 'network', 'The server cannot be reached; check your connection')
  }
  if (res.ok) return res
  const parsed = apiErrorBodySchema.safeParse(await res.json().catch(() => null))
  const error = parsed.success
    ? new ApiError(
        res.status,
        parsed.data.error.code,
        parsed.data.error.message,
        parsed.data.error.fields,
      )
    : new ApiError(res.status, 'http', `The server answered ${res.status}`)
  if (res.status === 401 && !quiet401) onUnauthorized()
  throw error
}
