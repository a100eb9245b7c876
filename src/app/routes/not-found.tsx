import { Link } from 'react-router-dom';

export function NotFoundRoute() {
  return (
    <section className="mx-auto max-w-xl px-4 py-16">
      <p className="num text-sm text-ember">404</p>
      <h1 className="mt-1 text-2xl font-semibold">No page here</h1>
      <p className="mt-2 text-ink-soft">The address may be mistyped, or the page moved. </p>
      <Link to="/" className="mt-4 inline-block rounded bg-ink px-3 py-1.5 text-paper">
        Back to Dwellform home
      </Link>
    </section>
  );
}
