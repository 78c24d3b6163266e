import type { Metadata } from "next";
import { CautionNotice } from "@/components/caution-notice";
import { loadSitePage } from "@/lib/auth/site-page";
import { CalculatorPanel } from "./calculator-panel";

export const metadata: Metadata = { title: "Capacity calculator" };

export default async function CalculatorPage({ params }: { params: Promise<{ siteId: string }> }) {
  const { siteId } = await params;
  const { site } = await loadSitePage(siteId);
  return (
    <div className="flex flex-col gap-4">
      <div>
        <h1 className="text-2xl font-bold">Capacity calculator</h1>
        <p className="text-ink-soft">
          Buckling capacity of a prop, strut or post at the length it is set to, with every step and the clause it comes from.
        </p>
      </div>
      <CautionNotice />
      <CalculatorPanel siteId={site.id} defaultUnits={site.unitSystem} defaultDesignCode={site.designCode} />
    </div>
  );
}
