import { Calculator } from "@/components/calculator/calculator";
import { OfflineNote } from "@/components/offline/offline-note";
import { Caution } from "@/components/ui/caution";
import { LAWS, LAW_IDS } from "@/lib/sizing";

export const metadata = { title: "Calculator" };
// Prerendered: the visitor's labs load separately (/api/v1/calculator), after the page.
export const dynamic = "force-static";

export default function CalculatorPage() {
  const laws = LAW_IDS.map((id) => ({ id, name: LAWS[id].name, formula: LAWS[id].formula, source: LAWS[id].source }));
  return (
    <div className="mx-auto max-w-2xl">
      <OfflineNote />
      <h1 className="text-2xl font-bold">Bifurcation calculator</h1>
      <p className="mt-1 text-base text-ink-soft">
        Enter two of the three diameters measured by QCA, IVUS or OCT; the law gives the third.
      </p>
      <Calculator laws={laws} />
      <Caution className="mt-6" />
    </div>
  );
}
