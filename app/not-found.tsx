import type { Metadata } from 'next';

import { NotFoundMessage } from '@/components/layout/not-found-message';

export const metadata: Metadata = { title: 'Not found' };

/** Any address the app does not have. */
export default function NotFound() {
  return (
    <main className="px-4 py-16">
      <NotFoundMessage />
    </main>
  );
}
