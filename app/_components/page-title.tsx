export function PageTitle({ title, lead }: { title: string; lead?: React.ReactNode }) {
  return (
    <div className="mb-6">
      <h1 className="text-2xl font-semibold tracking-tight">{title}</h1>
      {lead ? <p className="mt-1 max-w-3xl text-ink-soft">{lead}</p> : null}
    </div>
  );
}
