import { Alert } from '@/components/ui/alert';

/** The usual cautions for boiling and finishing; local codes and licensed practice come first. */
export function BoilingCautions() {
  return (
    <Alert tone="warning" title="Boiling and finishing safely">
      <ul className="list-disc pl-5">
        <li>Boiling sap and syrup cause severe burns: wear gloves and long sleeves at the draw-off and when filtering or packing.</li>
        <li>Never leave a firing evaporator unattended; keep the firebox door shut between loads and the stack and chimney clear (chimney fires).</li>
        <li>Ventilate the sugarhouse and keep a working carbon-monoxide alarm.</li>
        <li>Use lead-free pans, fittings and solder only.</li>
        <li>Syrup that is sold must meet your state’s or province’s food-safety, grading and labelling rules; hot-pack at 85 °C (185 °F).</li>
      </ul>
      <p className="text-sm">Local fire and building codes and licensed practice take precedence over this screen.</p>
    </Alert>
  );
}
