import type { CellColumn, MassUnit } from '../../shared/contracts/occurrence-row-cells.ts';
import type { SHAPE_CHOICE, ValueOf } from '../../shared/contracts/method-choices.ts';
import { Button } from './ui/button.tsx';

/**
 * The vocabulary of the companion-row editor (companion-rows-editor.tsx), which both a stored
 * occurrence table's page and the scenario builder's inline rows use: the classes, the mass
 * units, each distribution shape's parameters and the row actions.
 */

export const COMPANION_CLASS_OPTIONS = [
  { value: 'planet', label: 'Planet' },
  { value: 'brownDwarf', label: 'Brown dwarf' },
  { value: 'star', label: 'Low-mass star' },
] as const;

/** The three ways a row may give its mass range; exactly one is used. `value` is the CSV's massUnit cell. */
export const MASS_UNITS = [
  { key: 'massMJup', value: 'MJup', label: 'Jupiter masses', unit: 'MJup' },
  { key: 'massMsun', value: 'Msun', label: 'Solar masses', unit: 'Msun' },
  { key: 'massRatio', value: 'q', label: 'Mass ratio q = M2/M1', unit: 'q' },
] as const satisfies readonly { key: string; value: MassUnit; label: string; unit: string }[];
export type MassKey = (typeof MASS_UNITS)[number]['key'];

export interface ShapeParameter {
  /** The field inside `shape`, and the CSV column of the same name. */
  key: CellColumn & ('massSlope' | 'periodSlope' | 'meanLog10PeriodDays' | 'sigmaLog10Period');
  label: string;
  /** The symbol shown before a compact input ("a ="). */
  symbol: string;
  /** Empty for slopes. */
  unit: string;
  hint?: string;
}

/**
 * Each distribution shape's parameters, and a short name for narrow cells (the full label,
 * summary and sources are SHAPE_CHOICE's in shared/contracts/method-choices.ts).
 */
const SHAPES: Record<ValueOf<typeof SHAPE_CHOICE>, { shortLabel: string; parameters: readonly ShapeParameter[] }> = {
  powerlaw: {
    shortLabel: 'Power law',
    parameters: [
      { key: 'massSlope', label: 'Mass slope a', symbol: 'a', unit: '', hint: 'dN ∝ M^a dlnM.' },
      { key: 'periodSlope', label: 'Period slope b', symbol: 'b', unit: '', hint: 'dN ∝ P^b dlnP.' },
    ],
  },
  lognormalPeriod: {
    shortLabel: 'Log-normal P',
    parameters: [
      { key: 'meanLog10PeriodDays', label: 'Mean log10 period', symbol: 'μ', unit: 'log10 days' },
      { key: 'sigmaLog10Period', label: 'Spread of log10 period', symbol: 'σ', unit: 'dex' },
    ],
  },
};

const shapeOf = (shape: unknown) => SHAPES[typeof shape === 'string' && shape in SHAPES ? (shape as keyof typeof SHAPES) : 'powerlaw'];

/** The parameters of a shape kind (the others are ignored); an unknown or missing kind reads as a power law, as the row reader does. */
export function shapeParameters(shape: unknown): readonly ShapeParameter[] {
  return shapeOf(shape).parameters;
}

/** The shapes for a narrow select: value and short name. */
export const SHAPE_SHORT_OPTIONS = Object.entries(SHAPES).map(([value, { shortLabel }]) => ({ value, label: shortLabel }));

export interface RowActionsProps {
  /** 1-based, read out with each button ("Duplicate row 3"). */
  row: number;
  onDuplicate: () => void;
  onRemove: () => void;
  /** Moves the row one place up (-1) or down (+1); absent where it cannot move that way. */
  onMoveUp?: () => void;
  onMoveDown?: () => void;
  /** No room for another row. */
  duplicateDisabled?: boolean;
  className?: string;
}

/** A row's Move up, Move down, Duplicate and Remove buttons. */
export function RowActions({ row, onDuplicate, onRemove, onMoveUp, onMoveDown, duplicateDisabled = false, className }: RowActionsProps) {
  return (
    <div className={className}>
      <Button variant="ghost" size="sm" disabled={!onMoveUp} onClick={onMoveUp}>
        Move up<span className="sr-only"> row {row}</span>
      </Button>
      <Button variant="ghost" size="sm" disabled={!onMoveDown} onClick={onMoveDown}>
        Move down<span className="sr-only"> row {row}</span>
      </Button>
      <Button variant="ghost" size="sm" disabled={duplicateDisabled} onClick={onDuplicate}>
        Duplicate<span className="sr-only"> row {row}</span>
      </Button>
      <Button variant="ghost" size="sm" className="text-coral-300" onClick={onRemove}>
        Remove<span className="sr-only"> row {row}</span>
      </Button>
    </div>
  );
}
