import type { Page } from 'playwright-core';

/** Roles a person operates; each must be announced with a name (WAI-ARIA 1.2, "name required" roles). */
const operable = new Set([
  'button', 'link', 'textbox', 'searchbox', 'checkbox', 'radio', 'switch', 'combobox', 'listbox', 'option',
  'slider', 'spinbutton', 'tab', 'menuitem', 'menuitemcheckbox', 'menuitemradio', 'progressbar', 'radiogroup',
  'table', 'grid', 'dialog', 'alertdialog', 'img', 'image',
]);

interface AXValue { value?: unknown }
interface AXNode {
  ignored: boolean;
  role?: AXValue;
  name?: AXValue;
  properties?: { name: string; value: AXValue }[];
  backendDOMNodeId?: number;
}

/**
 * Every control (or picture) in the page's accessibility tree that a screen
 * reader would announce without a name, read from Chromium's own computed
 * tree over the DevTools protocol, so the names are the browser's, not ours.
 * A focusable node of any role counts as a control too.
 */
export async function unnamedControls(page: Page): Promise<string[]> {
  const cdp = await page.context().newCDPSession(page);
  try {
    const { nodes } = (await cdp.send('Accessibility.getFullAXTree')) as { nodes: AXNode[] };
    const found: string[] = [];
    for (const node of nodes) {
      if (node.ignored) continue;
      const role = String(node.role?.value ?? '');
      const name = String(node.name?.value ?? '').trim();
      const focusable = node.properties?.some((p) => p.name === 'focusable' && p.value.value === true) ?? false;
      if (name !== '' || !(operable.has(role) || (focusable && role !== 'RootWebArea' && role !== 'rootWebArea'))) continue;
      let html = '';
      if (node.backendDOMNodeId) {
        const { object } = (await cdp.send('DOM.resolveNode', { backendNodeId: node.backendDOMNodeId })) as { object: { objectId?: string } };
        if (object.objectId) {
          const r = (await cdp.send('Runtime.callFunctionOn', {
            objectId: object.objectId,
            functionDeclaration: 'function () { return (this.outerHTML || String(this.nodeName)).slice(0, 160); }',
            returnByValue: true,
          })) as { result: { value?: string } };
          html = r.result.value ?? '';
        }
      }
      found.push(`${role}${focusable ? ' (focusable)' : ''}: ${html}`);
    }
    return found;
  } finally {
    await cdp.detach();
  }
}
