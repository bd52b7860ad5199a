import { describe, expect, it } from 'vitest';
import { ORIGIN, useSeededApp, signIn } from '../helpers/web.ts';

const fixture = useSeededApp();

describe('statistics page', () => {
  it('shows agreement, calibration and exposure with SVG charts that carry a title, a text alternative and a table of the numbers', async () => {
    const { cookie } = await signIn(fixture.app, 'data');
    const batch = await fixture.store.db.selectFrom('batches').select('id').executeTakeFirstOrThrow();
    const res = await fixture.app.request(`/stats?batch=${batch.id}`, { headers: { cookie } });
    expect(res.status).toBe(200);
    const html = await res.text();
    expect(html).toMatch(/Mean pairwise agreement between reviewers of the same item: \d+\.\d%/);
    expect(html).toContain('<svg role="img"');
    expect(html).toMatch(/<title id="heuristics-against-final-decisions-title">/);
    expect(html).toMatch(/<desc id="heuristics-against-final-decisions-desc">Pairwise accuracy over \d+ decided pairs/);
    expect(html).toContain('Heuristics against final decisions — the numbers');
    expect(html).toContain('suggested order');
    expect(html).toContain('longer response won');
    expect(html).toContain('<td>reviewer2</td>');
    expect(html).not.toContain('Fit weights'); // data engineers see statistics, not the weight fit
  });

  it('offers learned weights to a policy owner as a draft for the editor, changing nothing', async () => {
    const policy = await signIn(fixture.app, 'policy');
    const batch = await fixture.store.db.selectFrom('batches').select('id').executeTakeFirstOrThrow();
    const versionsBefore = await fixture.store.db.selectFrom('rubric_versions').selectAll().execute();
    const page = await fixture.app.request(`/stats?batch=${batch.id}`, { headers: { cookie: policy.cookie } });
    expect(await page.text()).toContain('Fit weights');
    const res = await fixture.app.request('/stats/weights', { method: 'POST', headers: { cookie: policy.cookie, origin: ORIGIN, 'content-type': 'application/x-www-form-urlencoded' }, body: new URLSearchParams({ _csrf: policy.csrf, batch: String(batch.id) }) });
    expect(res.status).toBe(200);
    const html = await res.text();
    expect(html).toMatch(/Held-out pairwise accuracy: present weights \d+\.\d%; fitted weights \d+\.\d%/);
    expect(html).toContain('action="/rubrics/cairnfield-support/draft"');
    const draft = html.match(/name="source" value="([^"]*)"/)![1].replace(/&quot;/g, '"').replace(/&#39;/g, "'").replace(/&amp;/g, '&').replace(/&lt;/g, '<').replace(/&gt;/g, '>');
    const editor = await fixture.app.request('/rubrics/cairnfield-support/draft', { method: 'POST', headers: { cookie: policy.cookie, origin: ORIGIN, 'content-type': 'application/x-www-form-urlencoded' }, body: new URLSearchParams({ _csrf: policy.csrf, source: draft }) });
    expect(editor.status).toBe(200);
    expect(await editor.text()).toContain('No problems.');
    expect(await fixture.store.db.selectFrom('rubric_versions').selectAll().execute()).toEqual(versionsBefore);
  });

  it('keeps the statistics from reviewers and the weight fit from everyone but policy owners', async () => {
    const reviewer = await signIn(fixture.app, 'reviewer');
    expect((await fixture.app.request('/stats', { headers: { cookie: reviewer.cookie } })).status).toBe(403);
    const data = await signIn(fixture.app, 'data');
    const res = await fixture.app.request('/stats/weights', { method: 'POST', headers: { cookie: data.cookie, origin: ORIGIN, 'content-type': 'application/x-www-form-urlencoded' }, body: new URLSearchParams({ _csrf: data.csrf, batch: '1' }) });
    expect(res.status).toBe(403);
  });
});
