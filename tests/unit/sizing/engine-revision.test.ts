import { createHash } from 'node:crypto';

import { describe, expect, it } from 'vitest';

import { sizeDesign } from '@/lib/boards/size-design';
import { ENGINE_ANSWERS, ENGINE_REVISION } from '@/lib/sizing/revision';
import { sizeSite } from '@/lib/supply';
import { demoWays, FINISHING_BOARD, FLAT_BOARD, WORKSHOP_BOARD, WORKSHOP_SITE_BOARD } from '@/scripts/demo-data';

import { threeLevel, twoLevel } from '../supply/fixtures';

// A change detector, not a check of the numbers (the engine's other tests hold those): the
// engine's whole answers for the demo boards and the supply tests' trees, hashed. When it fails,
// the engine's answers changed: raise ENGINE_REVISION in lib/sizing/revision.ts, so that every
// stored sizing of the old revision is sized again on its first read, and record the new hash.
describe('the engine revision stored with each sizing', () => {
  it('names the answers the engine gives now', () => {
    const answers = [
      // Way ids fixed (demoWays gives random ones)
      ...[FLAT_BOARD, WORKSHOP_BOARD, WORKSHOP_SITE_BOARD, FINISHING_BOARD].map((b, n) =>
        sizeDesign({ ...b.settings, ways: demoWays(b).map((w, i) => ({ ...w, id: `b${n}w${i}` })) }),
      ),
      sizeSite(twoLevel()),
      sizeSite(threeLevel()),
    ];
    const hash = createHash('sha256').update(JSON.stringify(answers)).digest('hex');
    expect({ revision: ENGINE_REVISION, answers: hash }).toEqual({
      revision: ENGINE_REVISION,
      answers: ENGINE_ANSWERS,
    });
  });
});
