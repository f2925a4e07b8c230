import { useEffect, useRef, useState, type ReactNode, type ReactPortal } from 'react';
import { View, type ViewStyle } from 'react-native';

// Web only (app.json lists no other platform); react-dom ships no types here.
const { createPortal } = require('react-dom') as { createPortal: (children: ReactNode, container: Element) => ReactPortal };

/**
 * A sheet along the right edge of a wide screen, for a selection's detail
 * when the content is too narrow to hold it alongside; the content moves
 * aside while it is open (global.css), so nothing is hidden under it. It is
 * mounted on <body> because the page scrolls inside a transformed element,
 * where `position: fixed` would not hold.
 *
 * Being last in the document, it would also be last in the Tab order, behind
 * every row and control of the page. So it takes the focus when it opens, and
 * Escape (or Close) hands the focus back to whatever opened it, such as the
 * table row, for a keyboard user to carry on from there.
 */
export function SideSheet({ label, onClose, children }: { label: string; onClose: () => void; children: ReactNode }) {
  const [host, setHost] = useState<Element | null>(null);
  const sheet = useRef<View>(null);
  useEffect(() => setHost(document.body), []);
  useEffect(() => {
    const onKey = (e: KeyboardEvent) => e.key === 'Escape' && onClose();
    document.addEventListener('keydown', onKey);
    return () => document.removeEventListener('keydown', onKey);
  }, [onClose]);
  useEffect(() => {
    if (!host) return;
    // global.css moves the page content aside while this attribute is set, so nothing hides under the sheet.
    document.body.setAttribute('data-side-sheet', 'open');
    const opener = document.activeElement instanceof HTMLElement ? document.activeElement : null;
    (sheet.current as unknown as HTMLElement | null)?.focus();
    return () => {
      document.body.removeAttribute('data-side-sheet');
      // Back to the opener if it is still on the page (a disposed row may have left a filtered table).
      if (opener?.isConnected) opener.focus();
    };
  }, [host]);
  if (!host) return null;
  return createPortal(
    <View
      ref={sheet}
      role="complementary"
      aria-label={label}
      tabIndex={-1}
      className="hidden border-l border-rule-strong bg-paper-deep outline-none lg:flex lg:w-80 xl:w-96"
      style={sheetStyle}
    >
      {children}
    </View>,
    host,
  );
}

const sheetStyle = { position: 'fixed', top: 0, right: 0, bottom: 0, zIndex: 20, boxShadow: '-6px 0 18px rgba(29,39,51,0.12)' } as unknown as ViewStyle;
