'use client';

import Link from 'next/link';
import { usePathname } from 'next/navigation';
import { signOut } from 'next-auth/react';

import { cn } from '@/lib/cn';

type ShellProps = {
  links: { href: string; label: string }[];
  user: { name: string; role: string };
  children: React.ReactNode;
};

/** The frame of every signed-in page: a slim top bar with the sections and the member. */
export function AppShell({ links, user, children }: ShellProps) {
  const pathname = usePathname();
  return (
    <div className="flex min-h-screen flex-col">
      <header className="border-b border-line bg-paper-raised">
        {/* On a phone the sections take a row of their own under the name, so none is hidden */}
        <div className="mx-auto flex max-w-[1400px] flex-wrap items-center gap-x-6 gap-y-1 px-4 py-2 sm:h-14 sm:flex-nowrap sm:py-0">
          <Link href="/boards" className="flex items-center gap-2 font-semibold tracking-tight">
            <span aria-hidden className="inline-block h-4 w-4 rounded-sm bg-copper" />
            Boardwright
          </Link>
          <nav
            aria-label="Sections"
            className="order-last -mx-3 flex w-full flex-wrap items-center gap-1 sm:order-none sm:mx-0 sm:w-auto sm:flex-1 sm:flex-nowrap sm:overflow-x-auto"
          >
            {links.map((link) => {
              const active = pathname === link.href || pathname.startsWith(`${link.href}/`);
              return (
                <Link
                  key={link.href}
                  href={link.href}
                  aria-current={active ? 'page' : undefined}
                  className={cn(
                    'rounded-md px-3 py-1.5 text-sm whitespace-nowrap',
                    active ? 'bg-paper-sunk font-medium text-ink' : 'text-ink-soft hover:text-ink',
                  )}
                >
                  {link.label}
                </Link>
              );
            })}
          </nav>
          <div className="ml-auto flex items-center gap-3 text-sm sm:ml-0">
            <span className="hidden text-ink-soft sm:inline">
              {user.name} · <span className="capitalize">{user.role}</span>
            </span>
            <button
              type="button"
              onClick={() => signOut({ callbackUrl: '/login' })}
              className="rounded-md border border-line-strong px-2.5 py-1 text-ink-soft hover:text-ink"
            >
              Sign out
            </button>
          </div>
        </div>
      </header>
      <main className="mx-auto w-full max-w-[1400px] flex-1 px-4 py-6">{children}</main>
    </div>
  );
}
