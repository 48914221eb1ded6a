import { srmToHex } from '@/lib/brewing/colour';

const SIZES = { sm: 'h-4 w-4', md: 'h-6 w-6', lg: 'h-10 w-10' } as const;

/**
 * A square of approximate beer colour. The colour is an on-screen guess, so
 * the accessible name carries the number too.
 */
export function SrmSwatch({
  srm,
  size = 'md',
  className = '',
}: {
  srm: number;
  size?: keyof typeof SIZES;
  className?: string;
}) {
  const rounded = Math.round(srm);
  return (
    <span
      role="img"
      aria-label={`colour swatch, about ${rounded} SRM`}
      className={`inline-block shrink-0 rounded-sm border border-line align-middle ${SIZES[size]} ${className}`}
      style={{ backgroundColor: srmToHex(srm) }}
    />
  );
}
