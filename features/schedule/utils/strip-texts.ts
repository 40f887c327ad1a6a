import 'server-only';

import { LRUCache } from 'lru-cache';

import type { WalkData } from '@/lib/boards/walk-types';

import { fitLabelText } from './build-labels';
import { printFontMeasure } from './fonts';

// What the strip prints, by label width and text: fitting a walk of 37 labels takes about half a
// millisecond, and a walk is read again after every label checked (a pure function of the two)
const printed = new LRUCache<string, string>({ max: 5000 });

/**
 * The walk with what the printed strip reads for each label it shortens to fit (`stripText`):
 * the installer compares the label in the board with the strip as printed, and is told when
 * that is not the schedule's whole text.
 */
export async function withStripTexts(walk: WalkData): Promise<WalkData> {
  const measure = await printFontMeasure();
  return {
    ...walk,
    ways: walk.ways.map((way) => {
      const key = `${way.modules}:${way.labelText}`;
      let text = printed.get(key);
      if (text === undefined) printed.set(key, (text = fitLabelText(way.labelText, way.modules, measure).text));
      return text === way.labelText ? way : { ...way, stripText: text };
    }),
  };
}
