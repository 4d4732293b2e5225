import Link from "next/link";
import { BrandMark } from "./_components/brand-mark";

export default function Forbidden() {
  return (
    <main className="flex min-h-screen items-center justify-center px-4">
      <div className="max-w-md text-center">
        <div className="mb-4 flex justify-center">
          <BrandMark size={48} />
        </div>
        <h1 className="text-2xl font-semibold">Not for your role</h1>
        <p className="mt-2 text-ink-soft">Your account does not hold a role that may open this page. Ask your group&apos;s admin if you need it.</p>
        <Link href="/" className="mt-6 inline-block text-copper-deep underline">
          Back to the overview
        </Link>
      </div>
    </main>
  );
}
