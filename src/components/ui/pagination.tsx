import { ChevronLeft, ChevronRight } from 'lucide-react';

import { Button } from '@/components/ui/button';
import { selectClassName } from '@/components/ui/form-styles';

type PaginationProps = {
  /** Plural noun for what is paged: "sites". */
  itemsName: string;
  page: number;
  pageSize: number;
  total: number;
  pageSizes?: readonly number[];
  onPageChange: (page: number) => void;
  onPageSizeChange: (pageSize: number) => void;
};

export function Pagination({
  itemsName,
  page,
  pageSize,
  total,
  pageSizes = [10, 25, 50, 100],
  onPageChange,
  onPageSizeChange,
}: PaginationProps) {
  const pageCount = Math.max(1, Math.ceil(total / pageSize));
  const first = total === 0 ? 0 : (page - 1) * pageSize + 1;
  const last = Math.min(total, page * pageSize);

  return (
    <nav
      aria-label={`Pages of ${itemsName}`}
      className="flex flex-wrap items-center justify-between gap-3 px-4 py-3 text-sm md:px-5"
    >
      <p aria-live="polite">
        {total === 0 ? (
          `No ${itemsName}`
        ) : (
          <>
            Showing <span className="font-mono">{first}</span>–
            <span className="font-mono">{last}</span> of <span className="font-mono">{total}</span>{' '}
            {itemsName}
          </>
        )}
      </p>
      <div className="flex flex-wrap items-center gap-2">
        <label className="flex items-center gap-2 whitespace-nowrap">
          <span>Per page</span>
          <select
            className={selectClassName({ size: 'dense', className: 'w-20' })}
            value={pageSize}
            onChange={(event) => onPageSizeChange(Number(event.target.value))}
          >
            {pageSizes.map((size) => (
              <option key={size} value={size}>
                {size}
              </option>
            ))}
          </select>
        </label>
        <Button
          variant="secondary"
          disabled={page <= 1}
          onClick={() => onPageChange(page - 1)}
          aria-label="Previous page"
        >
          <ChevronLeft aria-hidden="true" className="size-4" />
          <span aria-hidden="true">Previous</span>
        </Button>
        <span>
          Page <span className="font-mono">{page}</span> of{' '}
          <span className="font-mono">{pageCount}</span>
        </span>
        <Button
          variant="secondary"
          disabled={page >= pageCount}
          onClick={() => onPageChange(page + 1)}
          aria-label="Next page"
        >
          <span aria-hidden="true">Next</span>
          <ChevronRight aria-hidden="true" className="size-4" />
        </Button>
      </div>
    </nav>
  );
}
