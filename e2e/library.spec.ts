import { expect, test, type Page } from '@playwright/test';

// The team study library in a real browser against the built app, with sign-in through the local fake
// OAuth provider and mail through the local fake mail server. Demo data: server/db/seed/demo-studies.ts.
const LEAD_STUDY = 'Two-dwell cycle for the 24-ply panel';

async function signInFromPage(page: Page, login: string) {
  // a sign-in asks for nothing that is not there (the fake provider's page once cost a 404 for its icon)
  const missing: string[] = [];
  const onResponse = (res: { status: () => number; url: () => string }) => {
    if (res.status() === 404) missing.push(res.url());
  };
  page.on('response', onResponse);
  await page.goto('/sign-in?next=/team');
  await page.getByRole('link', { name: 'Continue to sign-in' }).click();
  await page.locator(`a[data-login="${login}"]`).click();
  await expect(page.getByTestId('signed-in-as')).toBeVisible();
  await page.waitForLoadState('networkidle');
  page.off('response', onResponse);
  expect(missing).toEqual([]);
}

async function signOut(page: Page) {
  await page.getByRole('button', { name: 'Sign out' }).click();
  await page.waitForURL('**/sign-in');
}

test('engineer forks a colleague’s study and saves a changed dwell; lead pins it; a new member joins by mail', async ({ page }) => {
  test.setTimeout(120_000);
  const stamp = Date.now().toString(36);

  // --- engineer: open a colleague's study, fork it, change a dwell, save ---
  await signInFromPage(page, 'tomas.reed');
  await page.waitForURL(/\/teams\/\d+$/);
  await expect(page.getByRole('heading', { level: 1, name: 'Tail Structures Cell' })).toBeVisible();
  await page.getByRole('link', { name: /TB-2407/ }).first().click();
  await expect(page.getByTestId('baseline')).toContainText('Released for the first-article build');
  await page.getByRole('link', { name: LEAD_STUDY }).first().click();
  await expect(page.getByRole('heading', { level: 1, name: LEAD_STUDY })).toBeVisible();
  await page.getByTestId('revision-2').getByRole('button', { name: 'Fork r2' }).click();

  // the fork opens in the workspace as a study of the engineer's own
  await page.waitForURL(/\/studies\/\d+$/);
  const forkId = page.url().match(/\/studies\/(\d+)$/)![1];
  await expect(page.getByRole('heading', { level: 1 })).toContainText('fork of r2');
  const dwell = page.getByLabel('Dwell 1 length');
  await dwell.fill('75');
  await dwell.press('Enter');
  await page.getByRole('button', { name: 'Save revision…' }).click();
  await page.getByLabel('What changed and why').fill(`First dwell 75 min (${stamp})`);
  await page.getByRole('button', { name: 'Save', exact: true }).click();
  await expect(page.getByRole('form', { name: 'Save a new revision' })).toBeHidden();

  await page.goto(`/studies/${forkId}/history`);
  await expect(page.getByTestId('forked-from')).toContainText(`${LEAD_STUDY} revision 2`);
  await expect(page.getByTestId('revision-2')).toContainText(`First dwell 75 min (${stamp})`);
  await expect(page.getByTestId('revision-2')).toContainText('Tomas Reed');
  // an engineer is not offered the pin
  await expect(page.getByRole('button', { name: 'Pin as baseline…' })).toHaveCount(0);
  await signOut(page);

  // --- lead: pin the engineer's revision as the part's baseline ---
  await signInFromPage(page, 'amara.okafor');
  await page.goto(`/studies/${forkId}/history`);
  const r2 = page.getByTestId('revision-2');
  await r2.getByRole('button', { name: 'Pin as baseline…' }).click();
  await r2.getByLabel('Why this baseline').fill(`Longer first dwell accepted (${stamp})`);
  await r2.getByRole('button', { name: 'Pin r2' }).click();
  await expect(r2.getByText('baseline', { exact: true })).toBeVisible();
  await page.getByRole('link', { name: /← TB-2407/ }).click();
  await expect(page.getByTestId('baseline')).toContainText(`Longer first dwell accepted (${stamp})`);
  await expect(page.getByTestId('baseline')).toContainText('Amara Okafor');
  // the fork says where it came from, and the part's history has the pin as a sentence
  await expect(page.getByTestId('fork-origin').first()).toContainText(`forked from ${LEAD_STUDY} r2`);
  await expect(page.getByTestId('part-history')).toContainText(/pinned “.*” r2 as baseline of TB-2407/);

  // --- lead: invite a new member; the pin shows in the audit trail ---
  await page.getByRole('link', { name: '← Team' }).click();
  await page.getByRole('link', { name: /Members/ }).click();
  await expect(page.getByTestId('audit-trail')).toContainText(/Amara Okafor pinned “.*” r2 as baseline of TB-2407 .*\(was “.*” r\d+\)/);
  const email = `noor.${stamp}@tamsinbay.example`;
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Invited role').selectOption('engineer');
  await page.getByRole('button', { name: 'Send invitation' }).click();
  await expect(page.getByText(`Invitation mailed to ${email}.`)).toBeVisible();
  // the dev mailbox (signed-in people only) stands in for the invitee's inbox
  await page.goto('/dev/mailbox');
  const mail = page.getByTestId('mail').filter({ hasText: email });
  await expect(mail).toHaveCount(1);
  await expect(mail).not.toContainText(/expires on \d{4}-/);
  const link = await mail.getByRole('link', { name: /\/invite\// }).getAttribute('href');
  await signOut(page);

  // --- the invitee: follow the link, sign in as someone new, accept ---
  await page.goto(link!);
  await expect(page.getByRole('heading', { name: 'Join Tail Structures Cell' })).toBeVisible();
  await expect(page.getByText('engineer', { exact: true })).toBeVisible();
  await page.getByRole('link', { name: 'Sign in to accept' }).click();
  await page.getByLabel('Login').fill(`noor-${stamp}`);
  await page.getByLabel('Name').fill('Noor Hale');
  await page.getByLabel('E-mail').fill(email);
  await page.getByRole('button', { name: 'Sign in as this person' }).click();
  await page.waitForURL(/\/invite\//);
  const inviteUrl = page.url();
  await page.getByRole('button', { name: 'Accept the invitation' }).click();
  await page.getByRole('link', { name: 'Open Tail Structures Cell' }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Tail Structures Cell' })).toBeVisible();
  await expect(page.getByText('engineer', { exact: true }).first()).toBeVisible();

  // the used link does not work a second time
  await page.goto(inviteUrl);
  await expect(page.getByRole('alert')).toContainText('already used');
});

test('a site admin creates a team with its first lead, and manages the demo team’s members without entering it', async ({ page }) => {
  const stamp = Date.now().toString(36);
  await signInFromPage(page, 'site.admin');
  await page.waitForURL(/\/team$/);
  // the demo team is listed, but opens on its members page (an admin reads no team's studies)
  await page.getByRole('link', { name: 'Tail Structures Cell' }).click();
  await page.waitForURL(/\/teams\/\d+\/members$/);
  await expect(page.getByRole('heading', { level: 1 })).toContainText('Members of Tail Structures Cell');
  await expect(page.getByLabel('Role of Ines Varga')).toBeVisible();
  await expect(page.getByTestId('audit-trail')).toBeVisible();

  await page.goto('/team');
  await page.getByRole('link', { name: 'Site administration' }).click();
  await page.getByLabel('Team name').fill(`Nacelle Cell ${stamp}`);
  await page.getByLabel('First lead\'s e-mail').fill(`lead.${stamp}@tamsinbay.example`);
  await page.getByRole('button', { name: 'Create team' }).click();
  await expect(page.getByRole('form', { name: 'Create a team' }).getByRole('status')).toContainText(`An invitation to lead it was mailed to lead.${stamp}@tamsinbay.example`);
  await expect(page.getByTestId('admin-teams')).toContainText(`Nacelle Cell ${stamp}`);
});
