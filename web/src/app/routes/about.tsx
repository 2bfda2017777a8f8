import { CautionBlock } from '../../components/ui/caution-block';
import { PageHeader } from '../../components/ui/page-header';
import { APP_VERSION, PLANT_NAME, PRODUCT_SUMMARY } from '../../config/product';

export function AboutPage() {
  return (
    <div className="max-w-3xl space-y-4 text-sm">
      <PageHeader title="About Shadowloop" description={PRODUCT_SUMMARY} />
      <section className="space-y-2">
        <h2 className="text-base font-bold">How it works</h2>
        <p>
          A control engineer registers a loop and its identified discrete-time state-space model, x(k+1) = A x(k) + B
          u(k), y(k) = C x(k) + D u(k), at the loop&apos;s sample period. Once a model version is reviewed and
          activated, its twin takes the measured inputs each sample, predicts the next state, and compares the
          prediction with the readings from the plant historian.
        </p>
        <p>
          When the residuals leave the residual band and a drift rule builds up, Shadowloop raises a divergence alert
          and e-mails the on-call engineer. Its alerts are advisory and may come late or not at all; the plant&apos;s
          own alarms, trips and interlocks remain the protection.
        </p>
      </section>
      <CautionBlock heading="Cautions" />
      <dl className="grid grid-cols-[max-content_1fr] gap-x-4 gap-y-1">
        <dt className="font-bold">Plant</dt>
        <dd>{PLANT_NAME}</dd>
        <dt className="font-bold">Version</dt>
        <dd className="tabular-nums">{APP_VERSION}</dd>
      </dl>
    </div>
  );
}
