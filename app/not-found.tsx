import Link from "next/link";
import { BrandMark } from "./_components/brand-mark";

export default function NotFound() {
  return (
    <main className="flex min-h-screen items-center justify-center px-4">
      <div className="max-w-md text-center">
        <div className="mb-4 flex justify-center">
          <BrandMark size={48} />
        </div>
        <h1 className="text-2xl font-semibold">Nothing here</h1>
        <p className="mt-2 text-ink-soft">This page does not exist, or it was moved.</p>
        <Link href="/" className="mt-6 inline-block text-copper-deep underline">
          Back to the overview
        </Link>
      </div>
    </main>
  );
}
