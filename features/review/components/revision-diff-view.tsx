import type { FieldChange, RevisionDiff, WayMention } from '@/lib/boards/revision-diff';
import { isEmptyDiff } from '@/lib/boards/revision-diff';

const wayName = (w: WayMention, ref = w.ref) => `${ref ? `Way ${ref}` : w.device}: ${w.serves}`;

function Fields({ fields }: { fields: FieldChange[] }) {
  return (
    <ul className="mt-1 space-y-0.5 text-xs text-ink-soft">
      {fields.map((f) => (
        <li key={f.field}>
          {f.label}: <del className="text-verdict-fail">{f.before}</del> →{' '}
          <ins className="text-verdict-pass no-underline">{f.after}</ins>
        </li>
      ))}
    </ul>
  );
}

function Section({ title, count, children }: { title: string; count: number; children: React.ReactNode }) {
  if (!count) return null;
  return (
    <section className="space-y-1">
      <h4 className="text-sm font-semibold text-ink">
        {title} <span className="font-normal text-ink-soft">({count})</span>
      </h4>
      <ul className="space-y-1 text-sm">{children}</ul>
    </section>
  );
}

/** What changed between two states of a board, in words. */
export function RevisionDiffView({ diff }: { diff: RevisionDiff }) {
  if (isEmptyDiff(diff)) return <p className="text-sm text-ink-soft">No changes between these two.</p>;
  return (
    <div className="space-y-3">
      <Section title="Board settings changed" count={diff.settings.length}>
        <li>
          <Fields fields={diff.settings} />
        </li>
      </Section>
      <Section title="Ways added" count={diff.added.length}>
        {diff.added.map((w) => (
          <li key={w.id}>
            {wayName(w)} <span className="text-ink-soft">({w.device})</span>
          </li>
        ))}
      </Section>
      <Section title="Ways removed" count={diff.removed.length}>
        {diff.removed.map((w) => (
          <li key={w.id}>
            {wayName(w)} <span className="text-ink-soft">({w.device})</span>
          </li>
        ))}
      </Section>
      <Section title="Ways moved" count={diff.moved.length}>
        {diff.moved.map((w) => (
          <li key={w.id}>
            {w.serves}: {w.fromRef ? `way ${w.fromRef}` : w.from} → {w.ref ? `way ${w.ref}` : w.to}
          </li>
        ))}
      </Section>
      <Section title="Renumbered by other changes (labels to redo)" count={diff.renumbered.length}>
        {diff.renumbered.map((w) => (
          <li key={w.id}>
            {w.serves}: way {w.fromRef ?? '—'} → way {w.ref ?? '—'}
          </li>
        ))}
      </Section>
      <Section title="Ways changed" count={diff.changed.length}>
        {diff.changed.map((w) => (
          <li key={w.id}>
            {wayName(w)}
            <Fields fields={w.fields} />
          </li>
        ))}
      </Section>
    </div>
  );
}
