export function SafetyNote({ validity }: { validity?: string }) {
  return (
    <aside role="note" aria-label="Safety note" className="rounded-lg border border-copper/40 bg-copper-pale/50 px-4 py-3 text-sm leading-relaxed">
      <strong className="font-semibold">Safety note.</strong>{" "}
      {validity ? <>Validity range: {validity}. Results outside it are unverified. </> : <>Every release states its validity range; results outside it are unverified. </>}
      Released models feed simulations that may inform device and materials decisions; decisions with safety or financial
      consequences must rest on experiment and the responsible engineer&apos;s judgement, under local codes and practice.
    </aside>
  );
}
