import type { MyHome } from '@server/my/schema';
import { ChevronRight, House } from 'lucide-react';
import { Link } from 'react-router-dom';

import { buttonClassName } from '@/components/ui/button-styles';
import { Card } from '@/components/ui/card';
import { PostalAddress } from '@/components/ui/postal-address';
import { paths } from '@/config/paths';
import { WhoToCallCard } from '@/features/my-homes/components/who-to-call-card';

/** One home on the homeowner's start page: where it is, who to call, and the way in. */
export function MyHomeSummaryCard({ home }: { home: MyHome }) {
  return (
    <div className="grid gap-4">
      <Card title={home.name} icon={House}>
        <div className="grid gap-4">
          <PostalAddress address={home.address} />
          <Link
            to={paths.myHome.getHref(home.id)}
            className={buttonClassName({ size: 'lg', className: 'justify-between' })}
          >
            Open {home.name}
            <ChevronRight aria-hidden="true" className="size-5" />
          </Link>
        </div>
      </Card>
      <WhoToCallCard home={home} headingLevel={3} />
    </div>
  );
}
