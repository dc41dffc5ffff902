import type { Metadata, Viewport } from 'next';
import type { ReactNode } from 'react';
import { plexGreek, plexMono, plexSans } from './fonts';
import './globals.css';

export const metadata: Metadata = {
  title: { default: 'Crossfault', template: '%s · Crossfault' },
  description: 'Fault-exposure audit of control cabinet field wiring.',
};

export const viewport: Viewport = { width: 'device-width', initialScale: 1 };

export default function RootLayout({ children }: { children: ReactNode }) {
  return (
    <html lang="en" className={`${plexSans.variable} ${plexGreek.variable} ${plexMono.variable}`}>
      <body className="min-h-screen font-sans antialiased">{children}</body>
    </html>
  );
}
