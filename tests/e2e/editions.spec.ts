import { randomUUID } from 'node:crypto';
import { expect, test } from '@playwright/test';
import { SignInPage } from './pages/auth-pages';
import { EditionReviewPage, SpaceViewPage } from './pages/edition-pages';
import { expectNoSeriousA11yViolations } from './support/axe';
import { DEMO_LAB_SLUG as LAB, DEMO_PASSWORD, demoUser } from './support/demo';

test('freeze, review, return, freeze again, compare and approve; an Approved edition cannot be edited', async ({ browser }) => {
  test.setTimeout(120_000);
  const designer = await (await browser.newContext()).newPage();
  const reviewer = await (await browser.newContext()).newPage();
  await new SignInPage(designer).signInAndLand(demoUser('designer').email, DEMO_PASSWORD, /\/labs\/halden-form/);
  await new SignInPage(reviewer).signInAndLand(demoUser('reviewer').email, DEMO_PASSWORD, /\/labs\/halden-form/);

  // A fresh space on the demo seed (built through the API; the space editor has its own e2e).
  const seeds = (await (await designer.request.get(`/api/v1/labs/${LAB}/seed-shapes`)).json()) as { items: { id: string; name: string }[] };
  const seedShapeId = seeds.items.find((s) => s.name === 'Harbour pebble')!.id;
  const created = await designer.request.post(`/api/v1/labs/${LAB}/spaces`, {
    data: {
      name: `Review run ${randomUUID().slice(0, 6)}`,
      seedShapeId,
      axes: [
        { label: 'Second lobe', changes: [{ harmonic: 2, field: 'amplitude', delta: 0.08 }] },
        { label: 'Fourth lobe', changes: [{ harmonic: 4, field: 'amplitude', delta: 0.08 }] },
      ],
      extent: 1,
      layout: { kind: 'rings', rings: 3, spokes: 8 },
      normalization: { scale: 'equal-area-radius', centroid: true },
      equalize: false,
    },
  });
  expect(created.status()).toBe(201);
  const spaceId = ((await created.json()) as { id: string }).id;

  // 1. The designer draws a boundary (turned with the keyboard), freezes edition 1 and submits it.
  const view = new SpaceViewPage(designer);
  await view.open(LAB, spaceId);
  await view.addBoundary('Smooth vs lobed');
  await view.turnBoundary('boundary-1', 30);
  await expect(designer.getByTestId('boundary-line-boundary-1')).toHaveAttribute('data-angle', '30');
  await expect(designer.getByTestId('boundary-0-summary')).toContainText('side A 12 · ■ side B 12');
  await view.saveBoundaries();
  await designer.getByTestId('stimulus-picker').selectOption('r02-s01');
  await expect(designer.getByTestId('inspector-placements')).toContainText('Smooth vs lobed: side A, signed distance');
  await designer.screenshot({ path: 'test-results/screens/space-boundary.png', fullPage: true });
  await view.freeze('First cut for review');
  const designerReview = new EditionReviewPage(designer);
  await expect(designer.getByTestId('edition-review')).toContainText('edition 1');
  await designerReview.submit();
  await designer.screenshot({ path: 'test-results/screens/edition-in-review.png', fullPage: true });

  // 2. The reviewer comments on one stimulus and returns the edition.
  const review = new EditionReviewPage(reviewer);
  await review.open(LAB, spaceId, 1);
  await review.commentOn('r03-s02', 'The outer ring looks too lumpy here.');
  await expectNoSeriousA11yViolations(reviewer);
  await reviewer.screenshot({ path: 'test-results/screens/edition-review.png', fullPage: true });
  await review.returnWith('Turn the boundary to 45° and check ring 3.');

  // 3. The designer turns the boundary and freezes edition 2; edition 1 is superseded.
  await view.open(LAB, spaceId);
  await view.turnBoundary('boundary-1', 15);
  await view.saveBoundaries();
  await view.freeze('Boundary at 45°');
  await expect(designer.getByTestId('edition-review')).toContainText('edition 2');
  await designerReview.submit();

  // 4. The reviewer compares 1 with 2, then approves edition 2.
  await reviewer.goto(`/labs/${LAB}/spaces/${spaceId}/editions`);
  await expect(reviewer.getByTestId('edition-state-1')).toHaveText('Returned');
  await expect(reviewer.getByText('superseded by 2')).toBeVisible();
  await reviewer.getByTestId('compare-from').selectOption('1');
  await reviewer.getByTestId('compare-to').selectOption('2');
  await reviewer.getByTestId('compare-submit').click();
  await expect(reviewer.getByTestId('diff-parameters')).toContainText('/boundaries/0/angleDeg');
  await expect(reviewer.getByTestId('diff-parameters')).toContainText('45');
  await expect(reviewer.getByTestId('diff-changed-p-boundary-1-a')).toBeVisible();
  await expectNoSeriousA11yViolations(reviewer);
  await reviewer.screenshot({ path: 'test-results/screens/edition-diff.png', fullPage: true });
  await review.open(LAB, spaceId, 2);
  await review.approve('Even on both sides.');

  // 5. An approved edition does not change: no controls, and the API refuses with a clear message.
  await designerReview.open(LAB, spaceId, 2);
  await expect(designerReview.state()).toHaveText('Approved');
  await expect(designer.getByTestId('submit-edition')).toHaveCount(0);
  const edit = await designer.request.patch(`/api/v1/labs/${LAB}/spaces/${spaceId}/editions/2`, { data: { changeNote: 'sneaky' } });
  expect(edit.status()).toBe(409);
  expect(((await edit.json()) as { detail: string }).detail).toMatch(/Approved.*never changes/);
});

test('the demo space carries an Approved edition 1 with its boundary', async ({ page }) => {
  await new SignInPage(page).signInAndLand(demoUser('experimenter').email, DEMO_PASSWORD, /\/labs\/halden-form/);
  await page.goto(`/labs/${LAB}/spaces`);
  await page.getByTestId('space-link-Pebble rings (demo)').click();
  await expect(page.getByTestId('boundary-line-smooth-vs-knobbly')).toHaveAttribute('data-angle', '45');
  await page.getByTestId('editions-link').click();
  await expect(page.getByTestId('edition-state-1')).toHaveText('Approved');
});
