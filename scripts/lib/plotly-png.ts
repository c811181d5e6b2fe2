/** A plotly figure rendered to a PNG file in headless Chromium (for the figures in docs/). */
import { readFileSync, writeFileSync } from 'node:fs';
import { chromium } from 'playwright-core';

export async function writePlotlyPng(out: URL, data: unknown[], layout: { width: number; height: number }): Promise<void> {
  const browser = await chromium.launch({ executablePath: '/usr/bin/chromium', args: ['--no-sandbox', '--disable-background-networking', '--disable-gpu'] });
  try {
    const page = await browser.newPage({ viewport: { width: layout.width, height: layout.height } });
    await page.setContent('<html><body style="margin:0"><div id="plot"></div></body></html>');
    await page.addScriptTag({ content: readFileSync(new URL('../../node_modules/plotly.js-dist-min/plotly.min.js', import.meta.url), 'utf8') });
    const png = await page.evaluate(
      async ([d, l]) => {
        const P = (window as unknown as { Plotly: { newPlot: Function; toImage: Function } }).Plotly;
        await P.newPlot('plot', d, l, { staticPlot: true });
        return (await P.toImage('plot', { format: 'png', width: l.width, height: l.height, scale: 1.5 })) as string;
      },
      [data, layout] as const,
    );
    writeFileSync(out, Buffer.from(png.replace(/^data:image\/png;base64,/, ''), 'base64'));
    console.log(`wrote ${out.pathname}`);
  } finally {
    await browser.close();
  }
}
