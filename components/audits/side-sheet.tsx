import { useEffect, useState, type ReactNode, type ReactPortal } from 'react';
import { View, type ViewStyle } from 'react-native';

// Web only (app.json lists no other platform); react-dom ships no types here.
const { createPortal } = require('react-dom') as { createPortal: (children: ReactNode, container: Element) => ReactPortal };

/**
 * A sheet along the right edge of a wide screen, over the shell's own pane,
 * so a selection's detail sits beside the content instead of under it. It is
 * mounted on <body> because the page scrolls inside a transformed element,
 * where `position: fixed` would not hold. Escape closes it.
 */
export function SideSheet({ label, onClose, children }: { label: string; onClose: () => void; children: ReactNode }) {
  const [host, setHost] = useState<Element | null>(null);
  useEffect(() => setHost(document.body), []);
  useEffect(() => {
    const onKey = (e: KeyboardEvent) => e.key === 'Escape' && onClose();
    document.addEventListener('keydown', onKey);
    return () => document.removeEventListener('keydown', onKey);
  }, [onClose]);
  if (!host) return null;
  return createPortal(
    <View role="complementary" aria-label={label} className="hidden border-l border-rule-strong bg-paper-deep lg:flex lg:w-80 xl:w-96" style={sheet}>
      {children}
    </View>,
    host,
  );
}

const sheet = { position: 'fixed', top: 0, right: 0, bottom: 0, zIndex: 20, boxShadow: '-6px 0 18px rgba(29,39,51,0.12)' } as unknown as ViewStyle;
