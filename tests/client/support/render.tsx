import { act, type ReactNode } from 'react';
import { createRoot, type Root } from 'react-dom/client';
import { QueryClientProvider } from '@tanstack/react-query';
import { createMemoryRouter, RouterProvider } from 'react-router-dom';
import { queryClient } from '../../../src/app/query-client';
import { routes } from '../../../src/app/router';

// Tell React this is a test environment, so act() flushes effects without warnings.
(globalThis as { IS_REACT_ACT_ENVIRONMENT?: boolean }).IS_REACT_ACT_ENVIRONMENT = true;

export type Rendered = { container: HTMLElement; unmount: () => void };

/** What is on screen now; tests/client/support/setup.ts unmounts it after each test. */
const mounted = new Set<Rendered>();

/** Renders into a fresh container with react-dom/client (no testing library is installed). */
export async function render(ui: ReactNode): Promise<Rendered> {
  const container = document.createElement('div');
  document.body.appendChild(container);
  let root: Root;
  await act(async () => {
    root = createRoot(container);
    root.render(ui);
  });
  const rendered: Rendered = {
    container,
    unmount: () => {
      if (!mounted.delete(rendered)) return; // already unmounted
      act(() => root.unmount());
      container.remove();
    },
  };
  mounted.add(rendered);
  return rendered;
}

/** Unmounts everything still rendered (after each test). */
export function unmountAll(): void {
  for (const r of [...mounted]) r.unmount();
}

/** The whole app's routes at `path`, with the app's query client, as the browser would get them. */
export async function renderRoutes(path: string): Promise<Rendered & { router: ReturnType<typeof createMemoryRouter> }> {
  const router = createMemoryRouter(routes, { initialEntries: [path] });
  const rendered = await render(
    <QueryClientProvider client={queryClient}>
      <RouterProvider router={router} />
    </QueryClientProvider>,
  );
  return { ...rendered, router };
}

/** The form control whose <label> reads exactly `text`. */
export function getByLabel<T extends HTMLElement = HTMLInputElement>(container: HTMLElement, text: string): T {
  const label = [...container.querySelectorAll('label')].find((l) => l.textContent?.trim() === text);
  if (!label) throw new Error(`No label "${text}"`);
  const control = label.htmlFor ? container.querySelector(`[id="${label.htmlFor}"]`) : label.querySelector('input,select');
  if (!control) throw new Error(`Label "${text}" has no control`);
  return control as T;
}

export function getButton(container: HTMLElement, name: string): HTMLButtonElement {
  const button = [...container.querySelectorAll('button')].find((b) => b.textContent?.trim() === name);
  if (!button) throw new Error(`No button "${name}"`);
  return button;
}

/** Types into a React-controlled or registered input the way a browser does (value setter + input event). */
export async function typeInto(input: HTMLInputElement, value: string) {
  await act(async () => {
    const setter = Object.getOwnPropertyDescriptor(HTMLInputElement.prototype, 'value')!.set!;
    setter.call(input, value);
    input.dispatchEvent(new Event('input', { bubbles: true }));
  });
}

export async function click(element: HTMLElement) {
  await act(async () => {
    element.click();
  });
}

/**
 * Waits (inside act) until `check` stops throwing, or fails after `timeout` ms. The default is generous
 * because the wait ends as soon as the check passes: a short one made tests fail on a busy machine.
 */
export async function waitFor<T>(check: () => T, timeout = 8000): Promise<T> {
  const start = Date.now();
  for (;;) {
    try {
      return check();
    } catch (error) {
      if (Date.now() - start > timeout) throw error;
      await act(async () => {
        await new Promise((r) => setTimeout(r, 10));
      });
    }
  }
}

export async function selectOption(select: HTMLSelectElement, value: string) {
  await act(async () => {
    const setter = Object.getOwnPropertyDescriptor(HTMLSelectElement.prototype, 'value')!.set!;
    setter.call(select, value);
    select.dispatchEvent(new Event('change', { bubbles: true }));
  });
}
