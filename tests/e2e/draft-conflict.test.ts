import { describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { DEMO_PASSWORD } from '../../seeders/data/demo-accounts';
import { demoAmideIsolation } from '../fixtures/routes/demo-amide-isolation';
import { useBrowserFlows } from './browser';

const flows = await useBrowserFlows({ profile: 'per-file', lastShot: 'conflict-last' });
const { base } = flows;

/** Runs a request in the page with the session's CSRF token: another tab, behind the editor's back. */
function api(page: Page, method: string, url: string, body?: unknown) {
  return page.evaluate(
    async ({ method, url, body }) => {
      const session = await (await fetch('/api/v1/session')).json();
      const reply = await fetch(url, {
        method,
        headers: { 'Content-Type': 'application/json', 'X-CSRF-Token': session.csrfToken },
        body: body === undefined ? undefined : JSON.stringify(body),
      });
      return { status: reply.status, body: await reply.json() };
    },
    { method, url, body },
  );
}

const stepNamed = (name: string) => {
  const doc = structuredClone(demoAmideIsolation) as unknown as {
    steps: Array<{ id: string; name: string }>;
  };
  doc.steps.find((s) => s.id === 'dry')!.name = name;
  return doc;
};

describe('draft conflicts in the editor', () => {
  it('"Reload their version" keeps mine recoverable, and "Keep mine" saves mine on top of theirs', async () => {
    const { page, shot, problems } = flows.browser;
    await page.goto(base + '/sign-in');
    await page.getByLabel('E-mail').fill('chemist@example.com');
    await page.getByLabel('Password').fill(DEMO_PASSWORD);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByRole('heading', { level: 1, name: 'Routes' }).waitFor();
    const workspaceId = page.url().split('/w/')[1].split('/')[0];
    const created = await api(page, 'POST', `/api/v1/workspaces/${workspaceId}/routes`, {
      name: `Conflict route ${Date.now().toString(36)} (invented)`,
      document: stepNamed('Dry (original)'),
    });
    const draftUrl = `/api/v1/workspaces/${workspaceId}/routes/${created.body.id}`;
    await page.goto(`${base}/w/${workspaceId}/routes/${created.body.id}`);
    const dry = () => page.getByRole('article', { name: /^Drying:/ });
    await dry().waitFor();

    // Someone else saves a change; then the chemist edits here (renames the drying step).
    const editHere = async (name: string) => {
      await dry().click();
      const field = page.getByLabel('Step name');
      await field.fill(name);
      await field.press('Tab');
      await page.getByText('This draft was changed elsewhere').waitFor();
    };
    const theirs = await api(page, 'PUT', `${draftUrl}/draft`, {
      document: stepNamed('Dry (their version)'),
      baseVersion: 1,
    });
    expect(theirs.status).toBe(200);
    await editHere('Dry (mine)');
    await shot('conflict-01-banner');

    await page.getByRole('button', { name: 'Reload their version' }).click();
    await expect(dry().getAttribute('aria-label')).resolves.toBe('Drying: Dry (their version)');
    await page.locator('[data-kept-version]').waitFor();
    await shot('conflict-02-theirs-mine-kept');
    // Mine comes back, and is then saved on top of theirs.
    await page.getByRole('button', { name: 'Restore my version' }).click();
    await expect(dry().getAttribute('aria-label')).resolves.toBe('Drying: Dry (mine)');
    await page.locator('[data-save-state="saved"]').waitFor();
    let server = await api(page, 'GET', draftUrl);
    expect(server.body.draftVersion).toBe(3);
    expect(server.body.draft.document.steps.find((s: { id: string }) => s.id === 'dry').name).toBe(
      'Dry (mine)',
    );

    // Second conflict: "Keep mine" saves mine over theirs, knowingly.
    expect(
      (
        await api(page, 'PUT', `${draftUrl}/draft`, {
          document: stepNamed('Dry (theirs again)'),
          baseVersion: 3,
        })
      ).status,
    ).toBe(200);
    await editHere('Dry (mine again)');
    await page.getByRole('button', { name: 'Keep mine' }).click();
    await page.locator('[data-save-state="saved"]').waitFor();
    server = await api(page, 'GET', draftUrl);
    expect(server.body.draftVersion).toBe(5);
    expect(server.body.draft.document.steps.find((s: { id: string }) => s.id === 'dry').name).toBe(
      'Dry (mine again)',
    );
    expect(problems.filter((p) => !/status of 409/.test(p))).toEqual([]);
  });
});
