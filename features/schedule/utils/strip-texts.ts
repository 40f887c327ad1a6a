import 'server-only';

import type { WalkData } from '@/lib/boards/walk-types';

import { fitLabelText } from './build-labels';
import { printFontMeasure } from './fonts';

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
      const { text } = fitLabelText(way.labelText, way.modules, measure);
      return text === way.labelText ? way : { ...way, stripText: text };
    }),
  };
}
