export interface Session {
  cookie: string;
  token: string;
}

/** Signs in through the API as a browser does: a CSRF token, the login, then the session's token. */
export async function signIn(
  base: string,
  email: string,
  password = 'workback-demo',
): Promise<Session> {
  const csrf = await fetch(`${base}/api/auth/csrf`);
  const first = csrf.headers.getSetCookie().map((c) => c.split(';')[0]);
  const { token } = (await csrf.json()) as { token: string };
  const login = await fetch(`${base}/api/auth/login`, {
    method: 'POST',
    headers: {
      'content-type': 'application/json',
      'x-csrf-token': token,
      cookie: first.join('; '),
    },
    body: JSON.stringify({ email, password }),
  });
  if (login.status !== 200) throw new Error(`sign-in of ${email} failed: ${login.status}`);
  const cookie = login.headers
    .getSetCookie()
    .map((c) => c.split(';')[0])
    .join('; ');
  const fresh = await fetch(`${base}/api/auth/csrf`, { headers: { cookie } });
  return { cookie, token: ((await fresh.json()) as { token: string }).token };
}
