import { cn } from '@/lib/utils';

/** A tab of the main navigation and the "More" dialog's rows (44 px touch targets). */
export const tabClass = (active: boolean) =>
  cn(
    'flex min-h-touch min-w-touch items-center justify-center rounded-lg px-2 text-center font-semibold leading-tight',
    'focus-visible:outline-3 focus-visible:outline-offset-2 focus-visible:outline-spruce',
    active ? 'bg-spruce text-birch-raised' : 'text-slate hover:bg-spruce-soft',
  );
