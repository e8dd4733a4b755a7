import { useEffect, useState } from 'react';
import { Button, type ButtonProps } from './button.tsx';

type CopyOutcome = 'idle' | 'copied' | 'failed';

/** Writes text to the clipboard; falls back to a selected hidden textarea where the Clipboard API is refused. */
async function writeClipboard(text: string): Promise<boolean> {
  try {
    await navigator.clipboard.writeText(text);
    return true;
  } catch {
    const area = document.createElement('textarea');
    area.value = text;
    area.setAttribute('readonly', '');
    area.style.position = 'fixed';
    area.style.opacity = '0';
    document.body.append(area);
    area.select();
    try {
      return document.execCommand('copy');
    } catch {
      return false;
    } finally {
      area.remove();
    }
  }
}

export interface CopyButtonProps extends Omit<ButtonProps, 'onClick' | 'children'> {
  text: string;
  /** The button's words: "Copy the token". */
  label: string;
}

/** A button that copies `text` and says, politely announced, whether that worked. */
export function CopyButton({ text, label, variant = 'secondary', size = 'sm', ...rest }: CopyButtonProps) {
  const [outcome, setOutcome] = useState<CopyOutcome>('idle');
  useEffect(() => {
    if (outcome === 'idle') return;
    const timer = setTimeout(() => setOutcome('idle'), 5000);
    return () => clearTimeout(timer);
  }, [outcome]);
  return (
    <span className="inline-flex flex-wrap items-center gap-3">
      <Button variant={variant} size={size} onClick={() => void writeClipboard(text).then((ok) => setOutcome(ok ? 'copied' : 'failed'))} {...rest}>
        {label}
      </Button>
      <span aria-live="polite" className={outcome === 'failed' ? 'text-sm font-bold text-coral-300' : 'text-sm font-bold text-kelp-300'}>
        {outcome === 'copied' ? 'Copied.' : outcome === 'failed' ? 'The browser refused: select the text and copy it by hand.' : ''}
      </span>
    </span>
  );
}
