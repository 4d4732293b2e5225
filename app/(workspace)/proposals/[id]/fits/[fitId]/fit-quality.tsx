import { BandPlot } from "@/app/_components/band-plot";
import type { FitQuality } from "@/lib/fits/quality";
import { ResidualPlot } from "./residual-plot";

/** The fit-quality figures: start and fitted bands over the aligned reference, and the residuals beneath. */
export function FitQualityFigures({ quality, referenceName }: { quality: FitQuality; referenceName: string }) {
  return (
    <div className="space-y-3">
      <BandPlot
        title={`Bands at the start values (dashed) and fitted (solid) over the aligned reference “${referenceName}” (dots)`}
        distance={quality.distance}
        ticks={quality.ticks}
        series={[
          { role: "base", label: "start values", energies: quality.start },
          { role: "proposal", label: "fitted", energies: quality.fitted },
          { role: "reference", label: `reference: ${referenceName}`, energies: quality.reference.energies, distance: quality.reference.distance },
        ]}
      />
      <ResidualPlot residuals={quality.residuals} distance={quality.distance} ticks={quality.ticks} title="Residuals of the fit along the path" />
    </div>
  );
}
