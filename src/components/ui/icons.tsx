import type { ReactNode } from 'react';
import { cx } from '../../lib/class-names.ts';

/** Small decorative line icons (24 × 24, drawn for Tidefield); always paired with text. */
function Icon({ className, children }: { className?: string; children: ReactNode }) {
  return (
    <svg
      viewBox="0 0 24 24"
      aria-hidden="true"
      focusable="false"
      fill="none"
      stroke="currentColor"
      strokeWidth="2"
      strokeLinecap="round"
      strokeLinejoin="round"
      className={cx('size-5 shrink-0', className)}
    >
      {children}
    </svg>
  );
}

type IconProps = { className?: string };

export const AlertIcon = ({ className }: IconProps) => (
  <Icon className={className}>
    <path d="M12 3 2.5 20h19L12 3Z" />
    <path d="M12 10v4.5M12 17.5v.01" />
  </Icon>
);

export const MenuIcon = ({ className }: IconProps) => (
  <Icon className={className}>
    <path d="M4 7h16M4 12h16M4 17h16" />
  </Icon>
);

export const CloseIcon = ({ className }: IconProps) => (
  <Icon className={className}>
    <path d="m6 6 12 12M18 6 6 18" />
  </Icon>
);

/** Up and down arrows; the active one is solid. */
export const SortIcon = ({ direction, className }: IconProps & { direction: 'ascending' | 'descending' | 'none' }) => (
  <Icon className={className}>
    <path d="m8 10 4-5 4 5" strokeOpacity={direction === 'ascending' ? 1 : 0.35} />
    <path d="m8 14 4 5 4-5" strokeOpacity={direction === 'descending' ? 1 : 0.35} />
  </Icon>
);

/** Tidefield's mark: a white dwarf inside the loops of its dipole field. */
export const TidefieldMark = ({ className }: IconProps) => (
  <svg viewBox="0 0 32 32" aria-hidden="true" focusable="false" className={cx('size-8 shrink-0', className)}>
    <g fill="none" strokeWidth="2" strokeLinecap="round" className="stroke-lantern-400">
      <path d="M16 12.5C9 3 1.5 8 1.5 16S9 29 16 19.5M16 12.5C23 3 30.5 8 30.5 16S23 29 16 19.5" />
      <path
        d="M16 13.2C12 8.5 7.5 10.5 7.5 16s4.5 7.5 8.5 2.8M16 13.2C20 8.5 24.5 10.5 24.5 16s-4.5 7.5-8.5 2.8"
        strokeOpacity="0.6"
      />
    </g>
    <circle cx="16" cy="16" r="3.4" className="fill-foam-50" />
  </svg>
);

export const CheckIcon = ({ className }: IconProps) => (
  <Icon className={className}>
    <path d="m5 12.5 4.5 4.5L19 7.5" />
  </Icon>
);

export const InfoIcon = ({ className }: IconProps) => (
  <Icon className={className}>
    <circle cx="12" cy="12" r="9" />
    <path d="M12 11v5.5M12 7.5v.01" />
  </Icon>
);
