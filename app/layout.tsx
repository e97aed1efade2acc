import type { Metadata } from 'next';
import type { ReactNode } from 'react';
import { plexMono, plexSans } from './fonts';
import './globals.css';

export const metadata: Metadata = {
  title: { default: 'Ampwarden', template: '%s · Ampwarden' },
  description: 'Size bus bars and cables by their heating, and get the sizing sheet reviewed and signed.',
};

export default function RootLayout({ children }: { children: ReactNode }) {
  return (
    <html lang="en" className={`${plexSans.variable} ${plexMono.variable}`}>
      <body className="min-h-screen">{children}</body>
    </html>
  );
}
