import { Outlet } from 'react-router-dom';
import { Footer } from './footer';
import { TopBar } from './top-bar';

export function RootLayout() {
  return (
    <div className="flex min-h-screen flex-col">
      <a href="#main" className="sr-only focus:not-sr-only focus:absolute focus:left-2 focus:top-2 focus:z-10 focus:rounded-control focus:bg-paper-50 focus:px-3 focus:py-1.5 focus:text-ink-900">
        Skip to content
      </a>
      <TopBar />
      <main id="main" tabIndex={-1} className="flex-1 outline-none">
        <Outlet />
      </main>
      <Footer />
    </div>
  );
}
