import Link from "next/link";
import { BrandMark } from "./brand-mark";

/** A whole-page message with the mark and a way back (not found, not allowed). */
export function MessagePage({ title, children }: { title: string; children: React.ReactNode }) {
  return (
    <main className="flex min-h-screen items-center justify-center px-4">
      <div className="max-w-md text-center">
        <div className="mb-4 flex justify-center">
          <BrandMark size={48} />
        </div>
        <h1 className="text-2xl font-semibold">{title}</h1>
        <p className="mt-2 text-ink-soft">{children}</p>
        <Link href="/" className="mt-6 inline-block text-copper-deep underline">
          Back to the overview
        </Link>
      </div>
    </main>
  );
}
