import type { Metadata } from 'next';
import localFont from 'next/font/local';
import { connection } from 'next/server';
import './globals.css';

const inter = localFont({
  src: [{ path: '../fonts/inter-latin-wght-normal.woff2', weight: '100 900', style: 'normal' }],
  variable: '--font-inter',
  display: 'swap',
});

export const metadata: Metadata = {
  title: { default: 'Plumeward', template: '%s · Plumeward' },
  description: 'Steam-trap survey workbench',
};

export default async function RootLayout({ children }: { children: React.ReactNode }) {
  // Every page renders per request, so Next can put proxy.ts's fresh CSP nonce on its scripts
  // (a page prerendered at build time, like the 404, would carry none and be blocked).
  await connection();
  return (
    <html lang="en" className={inter.variable}>
      <body className="min-h-screen font-sans">{children}</body>
    </html>
  );
}
