import { SearchX } from 'lucide-react';
import Link from 'next/link';

/**
 * The app's own "not found": what was asked for is not there (or belongs to another
 * organisation, which reads the same), and the ways back.
 */
export function NotFoundMessage() {
  return (
    <div className="mx-auto flex max-w-lg flex-col items-center gap-4 rounded-card border border-line bg-paper-raised px-6 py-10 text-center">
      <SearchX aria-hidden className="h-10 w-10 text-ink-soft" />
      <h1 className="text-2xl font-semibold tracking-tight text-ink">Not found</h1>
      <p className="text-sm leading-relaxed text-ink-soft">
        There is no such page, board or site in your organisation. It may have been deleted, or the link may be
        mistyped. Archived boards and sites are still here: look under “Show archived” in the lists.
      </p>
      <nav aria-label="Ways back" className="flex flex-wrap justify-center gap-4 text-sm font-medium">
        <Link href="/boards" className="text-copper-dark underline-offset-4 hover:underline">
          Boards
        </Link>
        <Link href="/sites" className="text-copper-dark underline-offset-4 hover:underline">
          Sites
        </Link>
      </nav>
    </div>
  );
}
