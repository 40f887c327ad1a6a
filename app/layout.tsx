import type { Metadata } from 'next';
import localFont from 'next/font/local';

import './globals.css';

const sans = localFont({
  src: '../node_modules/@fontsource-variable/inter/files/inter-latin-wght-normal.woff2',
  variable: '--font-sans',
  weight: '100 900',
  display: 'swap',
});

export const metadata: Metadata = {
  title: { default: 'Boardwright', template: '%s · Boardwright' },
  description: 'Design, size, review, print and check distribution boards.',
};

export default function RootLayout({ children }: { children: React.ReactNode }) {
  return (
    <html lang="en-GB" className={sans.variable}>
      <body className="min-h-screen font-sans">{children}</body>
    </html>
  );
}
