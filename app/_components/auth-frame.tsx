import { BrandMark } from "./brand-mark";

/** The centred card used by sign-in, joining and password reset. */
export function AuthFrame({ title, children }: { title: string; children: React.ReactNode }) {
  return (
    <main className="flex min-h-screen items-center justify-center px-4 py-10">
      <div className="w-full max-w-md">
        <div className="mb-6 flex items-center gap-3">
          <BrandMark size={44} />
          <div>
            <div className="text-2xl font-semibold tracking-tight">Bandgate</div>
            <div className="text-sm text-ink-soft">review and release of tight-binding models</div>
          </div>
        </div>
        <section className="rounded-xl border border-rule bg-card p-6 shadow-[0_1px_0_#d8cdb9]">
          <h1 className="mb-4 text-xl font-semibold">{title}</h1>
          {children}
        </section>
      </div>
    </main>
  );
}
