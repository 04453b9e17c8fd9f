import { PageHeader } from '../components/ui/page-header.ui';
import { useCurrentSession } from '../features/auth/hooks/use-current-session.hook';
import { UnitPricesPanel } from '../features/unit-prices/components/unit-prices-panel.component';

/** Firm settings: unit prices for cost estimates. Owners and managers edit; others read. */
export default function UnitPricesRoute() {
  const session = useCurrentSession();
  const canEdit = session.role === 'owner' || session.role === 'manager';
  return (
    <div className="flex flex-col gap-6">
      <title>Unit prices · Baywright</title>
      <PageHeader
        eyebrow={session.firm.name}
        title="Unit prices"
        description="Firm-wide prices for the cost estimates on Tonnage. Every change is kept with who made it and when."
      />
      <UnitPricesPanel canEdit={canEdit} />
    </div>
  );
}
