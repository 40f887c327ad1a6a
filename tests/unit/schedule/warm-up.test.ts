import { describe, expect, it } from 'vitest';

import { warmUpSource } from '@/features/schedule/print/warm-up';
import { renderSchedulePdf } from '@/features/schedule/render-schedule';

describe('the print warm-up board', () => {
  it('is sized without issues, every circuit passing, so that its render runs the whole schedule', async () => {
    const source = warmUpSource();
    expect(source.sizingIssues).toEqual([]);
    const verdicts = source.sizing!.ways.filter((w) => w.result).map((w) => w.result!.verdict);
    expect(verdicts).toEqual(['passes', 'passes']);
    const { pdf } = await renderSchedulePdf(source, new Date('2026-12-03T08:00:00Z'));
    expect(Buffer.from(pdf.subarray(0, 5)).toString()).toBe('%PDF-');
  }, 30_000);
});
