import { expect, test } from './support/browser-mode';

test('the console renders its main screen and the stage draws on its canvas', async ({ host, page, context }) => {
  await page.goto(host.url);
  await expect(page.getByRole('heading', { name: 'Gazeloom', level: 1 })).toBeVisible();
  await expect(page.getByRole('status')).toHaveText('host connected');
  await expect(page.getByText('browser mode (host on 127.0.0.1)')).toBeVisible();
  await expect(page.locator('.task-done', { hasText: 'Prepare the data folder' })).toBeVisible();

  // The stage is a second page; it authenticates with the cookie the console's URL set.
  const stage = await context.newPage();
  await stage.goto(`${host.origin}/stage/`);
  await expect(stage.locator('body')).toHaveAttribute('data-ready', 'true');
  const pixels = await stage.evaluate(() => {
    const canvas = document.getElementById('stage') as HTMLCanvasElement;
    const copy = document.createElement('canvas');
    copy.width = canvas.width;
    copy.height = canvas.height;
    const context2d = copy.getContext('2d')!;
    context2d.drawImage(canvas, 0, 0);
    const at = (x: number, y: number) => Array.from(context2d.getImageData(x, y, 1, 1).data.slice(0, 3));
    return { renderer: document.body.dataset.renderer, corner: at(5, 5), centre: at(Math.floor(canvas.width / 2), Math.floor(canvas.height / 2)) };
  });
  expect(pixels.renderer).toBe('webgl2');
  expect(pixels.corner).toEqual([128, 128, 128]); // resting mid-grey
  expect(pixels.centre).toEqual([96, 96, 96]); // the ready mark
  // The console hears that the stage connected.
  await expect(page.getByTestId('stage-status')).toContainText('drawing with WebGL2');
});

test('the stage falls back to Canvas 2D and draws the same resting screen', async ({ host, page, context }) => {
  await page.goto(host.url);
  const stage = await context.newPage();
  await stage.goto(`${host.origin}/stage/?renderer=canvas2d`);
  await expect(stage.locator('body')).toHaveAttribute('data-renderer', 'canvas2d');
  const pixels = await stage.evaluate(() => {
    const canvas = document.getElementById('stage') as HTMLCanvasElement;
    const context2d = canvas.getContext('2d')!;
    const at = (x: number, y: number) => Array.from(context2d.getImageData(x, y, 1, 1).data.slice(0, 3));
    return { corner: at(5, 5), centre: at(Math.floor(canvas.width / 2), Math.floor(canvas.height / 2)) };
  });
  expect(pixels).toEqual({ corner: [128, 128, 128], centre: [96, 96, 96] });
});

test('requests without the launch token get 401 and are logged', async ({ host, request }) => {
  const bare = await request.get(`${host.origin}/console/`, { headers: { cookie: '' } });
  expect(bare.status()).toBe(401);
  const wrong = await request.get(`${host.origin}/console/?token=not-the-token`);
  expect(wrong.status()).toBe(401);
  await expect.poll(() => host.output()).toContain('bridge.refused');
});
