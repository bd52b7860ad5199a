/** A user's browser, reduced to cookies and the CSRF token, talking to one app instance over HTTP. */
export class HttpUser {
  cookie = '';
  csrf = '';
  constructor(readonly base: string, readonly username: string, readonly password: string) {}

  private remember(res: Response) {
    const jar = new Map(this.cookie.split('; ').filter(Boolean).map((kv) => kv.split(/=(.*)/s, 2) as [string, string]));
    for (const line of res.headers.getSetCookie()) {
      const [name, value] = line.split(';')[0].split(/=(.*)/s, 2);
      jar.set(name, value);
    }
    this.cookie = [...jar].map(([k, v]) => `${k}=${v}`).join('; ');
  }

  async get(path: string): Promise<Response> {
    const res = await fetch(`${this.base}${path}`, { headers: { cookie: this.cookie }, redirect: 'manual' });
    this.remember(res);
    return res;
  }

  async post(path: string, fields: Record<string, string>): Promise<Response> {
    const res = await fetch(`${this.base}${path}`, { method: 'POST', redirect: 'manual', headers: { cookie: this.cookie, origin: this.base, 'content-type': 'application/x-www-form-urlencoded' }, body: new URLSearchParams({ _csrf: this.csrf, ...fields }) });
    this.remember(res);
    return res;
  }

  async signIn(): Promise<void> {
    const page = await this.get('/login');
    this.csrf = (await page.text()).match(/name="csrf-token" content="([^"]+)"/)![1];
    const res = await this.post('/login', { username: this.username, password: this.password, next: '/' });
    if (res.status !== 303) throw new Error(`${this.username} could not sign in: ${res.status}`);
    this.csrf = (await (await this.get('/')).text()).match(/name="csrf-token" content="([^"]+)"/)![1];
  }

  /** Takes the next item and submits a ranking (the first candidate first); the item id, or null when nothing waits. */
  async reviewNext(rationale: string, batchId?: number): Promise<{ itemId: number; status: number } | null> {
    const next = await this.get(batchId === undefined ? '/review/next' : `/review/next?batch=${batchId}`);
    if (next.status === 200) return null;
    if (next.status !== 303) throw new Error(`${this.username}: /review/next answered ${next.status}`);
    const path = next.headers.get('location')!;
    const page = await (await this.get(path)).text();
    const startedAt = page.match(/name="started_at" value="([^"]+)"/)![1];
    const ranks = Object.fromEntries([...page.matchAll(/name="(rank_[^"]+)"/g)].map((m, i) => [m[1], String(i + 1)]));
    const submitted = await this.post(`${path}/submit`, { ...ranks, rationale, started_at: startedAt });
    return { itemId: Number(path.split('/').pop()), status: submitted.status };
  }
}
