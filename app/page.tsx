import Link from 'next/link';
import { Logo } from '@/components/brand/logo';
import { Alert } from '@/components/ui/alert';
import { Badge } from '@/components/ui/badge';
import { buttonVariants } from '@/components/ui/button';
import { Card, CardBody, CardHeader, CardTitle } from '@/components/ui/card';
import { Table, TBody, TD, TH, THead, TR } from '@/components/ui/table';
import { cn } from '@/lib/utils';

const features = [
  {
    title: 'Book boil slots',
    body: 'Each household books its turns on the shared evaporator. Everyone sees who is boiling when, so nobody arrives to a cold pan or a double booking.',
  },
  {
    title: 'Log sap at the tank',
    body: 'Every drop-off is written down as it arrives: the litres poured and the °Brix read at the tank. That reading is what the split is built on.',
  },
  {
    title: 'Watch the boil queue',
    body: 'The queue updates live on every phone in the sugarhouse: which tank is feeding the pan, what is next, and when a run is drawn off.',
  },
  {
    title: 'Settle the season',
    body: 'At the end of the season each household receives an e-mailed statement: the sugar it delivered, its share of the syrup and its share of the fuel bill.',
  },
] as const;

// An illustration with round figures; the book uses each drop-off's own reading.
const example = [
  { household: 'Okafor', litres: 400, brix: '3.0', sugarKg: '12.1', sugarShare: '40%', bucketShare: '29%' },
  { household: 'Szabo', litres: 400, brix: '1.5', sugarKg: '6.0', sugarShare: '20%', bucketShare: '29%' },
  { household: 'Nakamura', litres: 600, brix: '2.0', sugarKg: '12.1', sugarShare: '40%', bucketShare: '43%' },
] as const;

export default function HomePage() {
  return (
    <>
      <a
        href="#main"
        className={cn(
          buttonVariants({ variant: 'primary', size: 'sm' }),
          'sr-only focus:not-sr-only focus:fixed focus:left-4 focus:top-4 focus:z-50',
        )}
      >
        Skip to content
      </a>

      <header className="border-b border-birch-line bg-birch-raised">
        <div className="mx-auto flex max-w-5xl items-center justify-between gap-4 px-4 py-3 sm:px-6">
          <Link href="/" className="inline-flex min-h-touch items-center rounded-lg no-underline">
            <Logo />
          </Link>
          <Link href="/sign-in" className={buttonVariants({ variant: 'secondary', size: 'sm' })}>
            Sign in
          </Link>
        </div>
      </header>

      <main id="main" className="mx-auto flex max-w-5xl flex-col gap-16 px-4 py-10 sm:px-6 sm:py-16">
        <section aria-labelledby="intro-title" className="flex flex-col gap-6">
          <p className="text-sm font-semibold uppercase tracking-wider text-spruce">For cooperative maple sugarhouses</p>
          <h1 id="intro-title" className="max-w-3xl text-4xl font-bold leading-tight text-balance sm:text-5xl">
            The shared book of a cooperative sugarhouse
          </h1>
          <p className="max-w-2xl text-lg leading-relaxed text-slate-muted">
            Several households tap their own maples, bring the sap to one sugarhouse and boil it together on a shared
            evaporator. Brixhouse keeps the book for all of them: who boils when, whose sap went into the tank and how
            sweet it was, and a fair split of the syrup and the fuel bill when the season ends.
          </p>
          <div className="flex flex-col gap-3 sm:flex-row">
            <Link href="/sign-in" className={buttonVariants({ variant: 'primary', size: 'lg' })}>
              Sign in
            </Link>
            <a href="#split" className={buttonVariants({ variant: 'secondary', size: 'lg' })}>
              How the split works
            </a>
          </div>
          <p className="text-base text-slate-muted">
            The demo is set up for the <strong className="font-semibold text-slate">Larkspur Hollow Sugar Cooperative</strong>,
            an invented co-op of seven households.
          </p>
        </section>

        <section aria-labelledby="features-title" className="flex flex-col gap-6">
          <h2 id="features-title" className="text-2xl font-bold sm:text-3xl">
            What the book keeps
          </h2>
          <ul className="grid gap-4 sm:grid-cols-2">
            {features.map((feature) => (
              <li key={feature.title} className="flex">
                <Card className="w-full">
                  <CardHeader>
                    <CardTitle as="h3">{feature.title}</CardTitle>
                  </CardHeader>
                  <CardBody>
                    <p className="leading-relaxed">{feature.body}</p>
                  </CardBody>
                </Card>
              </li>
            ))}
          </ul>
        </section>

        <section id="split" aria-labelledby="split-title" className="flex scroll-mt-6 flex-col gap-6">
          <h2 id="split-title" className="text-2xl font-bold sm:text-3xl">
            How the split works
          </h2>
          <div className="flex max-w-3xl flex-col gap-4 text-lg leading-relaxed">
            <p>
              Syrup is made from the sugar in the sap, not from the water, and sap varies a great deal in sweetness.
              Sap at 3.0 °Bx carries about twice the sugar of sap at 1.5 °Bx, so a litre of it earns about twice the
              syrup. Brixhouse therefore splits the syrup and the fuel bill by the sugar each household delivered, not
              by the bucket.
            </p>
            <p>
              Sugar is worked out from each drop-off&rsquo;s litres and its °Brix reading at the tank. Here is an
              example from Larkspur Hollow:
            </p>
          </div>

          <Table label="Example split by sugar" className="min-w-[36rem]">
            <caption className="sr-only">
              Example split for three households: sap delivered, °Brix, sugar and the resulting shares
            </caption>
            <THead>
              <TR>
                <TH>Household</TH>
                <TH numeric>Sap (L)</TH>
                <TH numeric>°Brix</TH>
                <TH numeric>Sugar (kg)</TH>
                <TH numeric>Share by sugar</TH>
                <TH numeric>If split by bucket</TH>
              </TR>
            </THead>
            <TBody>
              {example.map((row) => (
                <TR key={row.household}>
                  <TH scope="row">{row.household}</TH>
                  <TD numeric>{row.litres}</TD>
                  <TD numeric>{row.brix}</TD>
                  <TD numeric>{row.sugarKg}</TD>
                  <TD numeric className="font-semibold">
                    {row.sugarShare}
                  </TD>
                  <TD numeric className="text-slate-muted">
                    {row.bucketShare}
                  </TD>
                </TR>
              ))}
            </TBody>
          </Table>

          <p className="-mt-3 text-sm text-slate-muted">Figures rounded; losses in the pan left out.</p>
          <p className="max-w-3xl text-lg leading-relaxed">
            The Okafor and Szabo households each poured 400 L, but the Okafors&rsquo; sap was twice as sweet. Of the roughly
            34 L of syrup these three lots make, the Okafors take about 14 L and the Szabos about 7 L, and each pays the same
            share of the fuel bill as of the syrup. The e-mailed statement shows every household the readings its share came from.
          </p>
          <div className="flex flex-col gap-2">
            <p className="text-base text-slate-muted">Each run&rsquo;s syrup is recorded in its colour class:</p>
            <ul className="flex flex-wrap gap-2" aria-label="Syrup colour classes">
              <li>
                <Badge variant="golden">Golden</Badge>
              </li>
              <li>
                <Badge variant="amber">Amber</Badge>
              </li>
              <li>
                <Badge variant="dark">Dark</Badge>
              </li>
              <li>
                <Badge variant="very-dark">Very dark</Badge>
              </li>
            </ul>
          </div>
        </section>

        <section aria-labelledby="safety-title" className="flex flex-col gap-4">
          <h2 id="safety-title" className="text-2xl font-bold sm:text-3xl">
            Safety in the sugarhouse
          </h2>
          <Alert tone="warning" title="Brixhouse keeps the book; it does not make the boil safe.">
            <ul className="flex list-disc flex-col gap-1.5 pl-5">
              <li>Boiling syrup is hotter than boiling water and clings to skin, so its burns run deep. Keep children and pets back from the pan.</li>
              <li>
                Fireboxes and chimneys can catch fire. Keep the stack clean, keep clearances to timber, and have an
                extinguisher at hand.
              </li>
              <li>
                A closed sugarhouse can fill with carbon monoxide from the firebox or a gas rig. Ventilate and fit a CO
                alarm.
              </li>
              <li>
                Syrup sold to the public must follow local food-safety and labelling rules.
              </li>
            </ul>
            <p>Follow your local codes and licensed practice.</p>
          </Alert>
        </section>
      </main>

      <footer className="border-t border-birch-line bg-birch-raised">
        <div className="mx-auto flex max-w-5xl flex-col gap-3 px-4 py-6 text-sm text-slate-muted sm:flex-row sm:items-center sm:justify-between sm:px-6">
          <Logo />
          <p>Larkspur Hollow Sugar Cooperative is an invented demo co-op.</p>
        </div>
      </footer>
    </>
  );
}
