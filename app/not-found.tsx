import { SiteHeader } from '@/components/site-header';
import { ButtonLink } from '@/components/ui/button-link';

export default function NotFound() {
  return (
    <>
      <SiteHeader />
      <main id="main" className="mx-auto max-w-page px-6 py-24">
        <h1 className="text-2xl font-semibold">Nothing here</h1>
        <p className="mt-2 text-graphite-soft">The page does not exist, or you do not have access to it.</p>
        <ButtonLink href="/" variant="quiet" className="mt-6">
          Back to the start
        </ButtonLink>
      </main>
    </>
  );
}
