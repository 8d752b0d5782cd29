'use client';

import Link from 'next/link';
import { usePathname } from 'next/navigation';
import { cn } from '@/lib/utils';
import type { NavItem } from './nav-items';

interface AppNavProps {
  items: NavItem[];
}

export function AppNav({ items }: AppNavProps) {
  const pathname = usePathname();
  return (
    <nav aria-label="Main" className="-mx-1 flex gap-1 overflow-x-auto">
      {items.map((item) => {
        const active = pathname === item.href || pathname.startsWith(`${item.href}/`);
        return (
          <Link
            key={item.href}
            href={item.href}
            aria-current={active ? 'page' : undefined}
            className={cn(
              'inline-flex min-h-touch shrink-0 items-center rounded-lg px-3 font-semibold whitespace-nowrap',
              active ? 'bg-spruce text-birch-raised' : 'text-slate hover:bg-spruce-soft',
            )}
          >
            {item.label}
          </Link>
        );
      })}
    </nav>
  );
}
