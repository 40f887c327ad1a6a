import type { Metadata } from 'next';
import { redirect } from 'next/navigation';

import { SitesView } from '@/features/sites/components/sites-view';
import { getActor } from '@/lib/auth/session';

export const metadata: Metadata = { title: 'Sites' };

export default async function SitesPage() {
  const actor = await getActor();
  if (!actor) redirect('/login');
  return <SitesView role={actor.role} />;
}
