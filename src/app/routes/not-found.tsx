import { Link } from "react-router";

export default function NotFound() {
  return (
    <main className="mx-auto max-w-xl px-5 py-16">
      <h1 className="text-2xl font-bold">Nothing at this address</h1>
      <p className="mt-3 text-ink-soft">The link may be out of date, or the page may have moved.</p>
      <p className="mt-6">
        <Link to="/">See the vehicles for sale</Link>
      </p>
    </main>
  );
}
