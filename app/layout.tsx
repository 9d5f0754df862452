import type { Metadata } from 'next';
import { headers } from 'next/headers';
import type { ReactNode } from 'react';
import { plexMono, plexSans } from './fonts';
import './globals.css';

export const metadata: Metadata = {
  title: { default: 'Epicycle', template: '%s · Epicycle' },
  description: 'Novel shape stimuli with a known similarity structure, checked before the study.',
};

export default async function RootLayout({ children }: { children: ReactNode }) {
  // Reading the request makes every page dynamic, so each response gets a fresh CSP nonce.
  await headers();
  return (
    <html lang="en" className={`${plexSans.variable} ${plexMono.variable}`}>
      <body className="bg-paper font-sans text-graphite">{children}</body>
    </html>
  );
}
