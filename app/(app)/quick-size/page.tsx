import type { Metadata } from 'next';
import { notFound } from 'next/navigation';

import { QuickSizeForm } from '@/features/quick-size/components/quick-size-form';
import { can } from '@/lib/auth/permissions';
import { getActor } from '@/lib/auth/session';

export const metadata: Metadata = { title: 'Quick size' };

export default async function QuickSizePage() {
  const actor = await getActor();
  if (!actor || !can(actor.role, 'sizing.run')) notFound();
  return (
    <div className="flex flex-col gap-4">
      <header>
        <h1 className="text-2xl font-semibold tracking-tight">Quick size</h1>
        <p className="text-sm text-ink-soft">
          One circuit checked on its own, step by step, with the same engine the boards use.
        </p>
      </header>
      <QuickSizeForm />
    </div>
  );
}
