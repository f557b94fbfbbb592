// The request context a server action sees, for calling actions in the test process: the cookie
// jar and headers that next/headers hands out, and the signal next/navigation's redirect() throws.
// access-matrix.test.ts mocks those modules with these (vi.mock is hoisted, so it imports this file
// from inside its factories).

export class RedirectSignal extends Error {
  constructor(readonly url: string) {
    super(`redirect to ${url}`);
  }
}

export class NavigationSignal extends Error {
  constructor(readonly kind: "notFound" | "forbidden" | "unauthorized") {
    super(kind);
  }
}

interface Cookie {
  name: string;
  value: string;
}

/** What one call's request carries; reset before every cell. */
export const requestContext = {
  cookies: new Map<string, string>(),
  headers: new Headers(),
  revalidated: [] as string[],
  reset(cookies: Record<string, string>, headers: Record<string, string>) {
    this.cookies = new Map(Object.entries(cookies));
    this.headers = new Headers(headers);
    this.revalidated = [];
  },
};

/** Enough of Next's ReadonlyRequestCookies / ResponseCookies for the app's modules. */
export const cookieJar = {
  get(name: string): Cookie | undefined {
    const value = requestContext.cookies.get(name);
    return value === undefined ? undefined : { name, value };
  },
  getAll(): Cookie[] {
    return [...requestContext.cookies].map(([name, value]) => ({ name, value }));
  },
  has(name: string) {
    return requestContext.cookies.has(name);
  },
  set(nameOrCookie: string | (Cookie & Record<string, unknown>), value?: string) {
    const [name, v] = typeof nameOrCookie === "string" ? [nameOrCookie, value ?? ""] : [nameOrCookie.name, nameOrCookie.value];
    requestContext.cookies.set(name, v);
    return cookieJar;
  },
  delete(name: string) {
    requestContext.cookies.delete(name);
    return cookieJar;
  },
};
