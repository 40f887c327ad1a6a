// Browser entry of the diagram measurement (bundled by ./run.mjs): sizes a 30-board site in the
// page, then renders the diagram again and again into a fresh root and times each render.
import { flushSync } from 'react-dom';
import { createRoot } from 'react-dom/client';

import { SiteDiagram } from '@/components/site-diagram/site-diagram';
import { sizeSite, type SiteBoardInput } from '@/lib/supply';

import { threeLevel } from '../../tests/unit/supply/fixtures';

const tree = threeLevel();
// 27 more boards fed from the origin (copies of the finishing room board), 30 in all.
const base = tree.boards[2];
for (let i = 0; i < 27; i += 1) {
  tree.boards.push({
    ...base,
    id: `copy-${i}`,
    name: `Bay ${i + 1} board`,
    feed: { from: 'origin' },
  } as SiteBoardInput);
}
const site = sizeSite(tree);
const host = document.getElementById('root')!;

function renderOnce(): number {
  const el = document.createElement('div');
  host.replaceChildren(el);
  const root = createRoot(el);
  const t0 = performance.now();
  flushSync(() => root.render(<SiteDiagram site={site} siteName="Hollin Lane Joinery" hrefOf={(id) => `#${id}`} />));
  // Force layout so the time includes the browser's work on the new SVG.
  void el.getBoundingClientRect().height;
  return performance.now() - t0;
}

(window as unknown as { bench: (n: number) => number[] }).bench = (n: number) => {
  const times: number[] = [];
  for (let i = 0; i < n; i += 1) times.push(renderOnce());
  return times;
};
(window as unknown as { ready: boolean }).ready = true;

// A baseline in the same page: the same number of SVG elements with no content of ours, so the
// diagram's own cost can be told from this machine's speed at the time.
function Baseline({ n }: { n: number }) {
  return (
    <svg viewBox="0 0 400 4000" width="100%">
      {Array.from({ length: n }, (_, i) => (
        <g key={i}>
          <rect x={10} y={i * 8} width={300} height={6} />
          <text x={12} y={i * 8 + 5}>
            {`Row ${i}`}
          </text>
        </g>
      ))}
    </svg>
  );
}
(window as unknown as { baseline: (n: number, count: number) => number[] }).baseline = (n, count) => {
  const times: number[] = [];
  for (let i = 0; i < n; i += 1) {
    const el = document.createElement('div');
    host.replaceChildren(el);
    const root = createRoot(el);
    const t0 = performance.now();
    flushSync(() => root.render(<Baseline n={count} />));
    void el.getBoundingClientRect().height;
    times.push(performance.now() - t0);
  }
  return times;
};
