import { Text } from '../ui/text';

/**
 * A plain link the browser downloads (react-native-web renders Text with
 * `href` as an anchor and passes `hrefAttrs.download` on), so the session
 * cookie goes along and nothing passes through the app's router.
 */
export function DownloadLink({ href, label, filename }: { href: string; label: string; filename: string }) {
  const anchor = { href, hrefAttrs: { download: filename, rel: 'noopener' } } as object;
  return (
    <Text accessibilityRole="link" {...anchor} className="py-2 text-[15px] text-rust underline">
      ↓ {label}
    </Text>
  );
}
