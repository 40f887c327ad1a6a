import type { Metadata } from 'next';
import { redirect } from 'next/navigation';

import { BoardsView } from '@/features/boards/components/boards-view';
import { getActor } from '@/lib/auth/session';

export const metadata: Metadata = { title: 'Boards' };

export default async function BoardsPage() {
  const actor = await getActor();
  if (!actor) redirect('/login');
  return <BoardsView role={actor.role} />;
}
