import type { FeePercent } from '../../contracts/books/books-schemas';
import type { ProcessorFeeSettings } from './processor-fees';

/** Stored basis points (290) to the percentage people read (2.9). */
export function toFeePercent(s: ProcessorFeeSettings): FeePercent {
  return {
    percent: s.percentBasisPoints / 100,
    fixedCents: s.fixedCents,
    internationalExtraPercent: s.internationalExtraBasisPoints / 100,
  };
}

/** A typed percentage (2.9) to the basis points stored (290); the schema has already allowed two decimals at most. */
export function fromFeePercent(f: FeePercent): ProcessorFeeSettings {
  return {
    percentBasisPoints: Math.round(f.percent * 100),
    fixedCents: f.fixedCents,
    internationalExtraBasisPoints: Math.round(f.internationalExtraPercent * 100),
  };
}
