/** What the console's runs and shop settings routes answer (/api/admin/runs, /api/admin/shop): the server types its
 * answers with these; the console reads them. The settings themselves are `ShopSettings` in shop-settings-schemas.ts. */
import type { RunState } from '../labels/run-states';
import type { ShippingMethodCode } from '../labels/shipping-methods';
import type { WeightBracket } from './shipping-price';

/** The states staff may move a run to by hand (`sold_out` only ever follows from the count). */
export type RunMove = Exclude<RunState, 'sold_out'>;

/** GET /api/admin/runs (and the run POST /api/admin/runs and .../state answer): a print run with its count. */
export interface StaffRun {
  id: number;
  name: string;
  productName: string;
  productSlug: string;
  /** The state its dates and cap give now. */
  state: RunState;
  nextStates: RunMove[];
  cap: number;
  reserved: number;
  remaining: number;
  opensAt: string;
  closesAt: string;
  unitCostCents: number | null;
}

/** The printer's rules the sheet applies (from the shop settings). */
export interface PrinterRules {
  /** Extra pieces as a percentage of paid units, rounded up. */
  sparesPercent: number;
  /** The printer sells in packs of this many pieces per variant. */
  packMultiple: number;
  /** The printer's minimum pieces per design (the whole run). */
  minimumPerDesign: number;
}

/** One variant's line of the print-run sheet. */
export interface PrintSheetLine {
  variantId: number;
  label: string;
  sku: string;
  paid: number;
  spares: number;
  toPrint: number;
}

/** GET /api/admin/runs/:id/print-sheet: pieces to print per variant; a preview while orders can still arrive. */
export interface PrintSheet {
  run: {
    id: number;
    name: string;
    productName: string;
    state: RunState;
    cap: number;
    opensAt: string;
    closesAt: string;
  };
  kind: 'preview' | 'final';
  rules: PrinterRules;
  lines: PrintSheetLine[];
  totalPaid: number;
  totalToPrint: number;
  unitCostCents: number | null;
  estimatedCostCents: number | null;
}

/** GET /api/admin/shop/shipping-methods: every method, switched-off ones too, in their order. */
export interface StaffShippingMethod {
  id: number;
  code: ShippingMethodCode;
  name: string;
  brackets: WeightBracket[];
  active: boolean;
  position: number;
}
