import type { Metadata } from "next";
import { DilutionCalculator } from "@/components/prep/dilution-calculator";
import { PeroxideCalculator } from "@/components/prep/peroxide-calculator";
import { StandingCaution } from "@/components/practicals/standing-caution";
import { Card } from "@/components/ui/card";
import { PageHeader } from "@/components/ui/page-header";
import { requirePageRole } from "@/lib/auth/guards";

export const metadata: Metadata = { title: "Calculators" };

export default async function ToolsPage() {
  await requirePageRole(["teacher", "admin"], "/tools");
  return (
    <div className="flex max-w-4xl flex-col gap-6">
      <PageHeader title="Calculators" lead="For preparing solutions: diluting a stock solution, and converting between the ways hydrogen peroxide strength is written." />
      <StandingCaution />
      <div className="flex flex-col gap-6">
        <Card>
          <DilutionCalculator />
        </Card>
        <Card>
          <PeroxideCalculator />
        </Card>
      </div>
    </div>
  );
}
