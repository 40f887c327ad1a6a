import { When } from '@/components/ui/when';
import type { CommentDto } from '@/lib/boards/review-types';

/** Comments, oldest first, with who wrote them, on which revision and when. */
export function CommentThread({ comments }: { comments: CommentDto[] }) {
  if (!comments.length) return <p className="text-sm text-ink-faint">No comments yet.</p>;
  return (
    <ul className="space-y-2">
      {comments.map((c) => (
        <li key={c.id} className="rounded-md border border-line bg-paper px-3 py-2 text-sm">
          <div className="text-xs text-ink-soft">
            {c.authorName} · revision {c.revision} · <When iso={c.createdAt} />
          </div>
          <p className="whitespace-pre-wrap text-ink">{c.body}</p>
        </li>
      ))}
    </ul>
  );
}
