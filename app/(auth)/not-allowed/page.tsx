import type { Metadata } from 'next';
import Link from 'next/link';
import { buttonVariants } from '@/components/ui/button';
import { Card, CardBody, CardHeader, CardTitle } from '@/components/ui/card';

export const metadata: Metadata = { title: 'Not for your role' };

export default function NotAllowedPage() {
  return (
    <Card>
      <CardHeader>
        <CardTitle as="h1">That page is not for your role</CardTitle>
      </CardHeader>
      <CardBody className="flex flex-col gap-4">
        <p>
          It belongs to the co-op’s coordinators or sugarmakers. If you need it, ask your coordinator to change your role.
        </p>
        <Link href="/home" className={buttonVariants({ variant: 'primary' })}>
          Back to Today
        </Link>
      </CardBody>
    </Card>
  );
}
