import { PageHeading } from '../components/ui/page-heading';
import { SpannerLookup } from '../features/workshop/components/spanner-lookup';
import { ThreadLookup } from '../features/workshop/components/thread-lookup';
import { TorqueConverter } from '../features/workshop/components/torque-converter';
import { TorqueEstimate } from '../features/workshop/components/torque-estimate';

/** The public Workshop calculators: pure functions of src/shared, so the server renders them whole. */
export function WorkshopPage() {
  return (
    <>
      <title>Workshop calculators — Rivet & Reel</title>
      <meta
        name="description"
        content="Torque unit converter, thread and spanner look-ups, and a tightening-torque estimate, each traced to a named standard."
      />
      <PageHeading label="Workshop" title="Workshop calculators">
        <p>
          Conversions and look-ups a restorer reaches for, each traced to a named standard. They are for reading tables quickly, not for
          replacing your vehicle’s workshop manual.
        </p>
      </PageHeading>
      <div className="mt-8 grid gap-6 lg:grid-cols-2">
        <TorqueConverter />
        <SpannerLookup />
        <ThreadLookup />
        <TorqueEstimate />
      </div>
    </>
  );
}
