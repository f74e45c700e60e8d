import { lazy, useState, type ComponentProps, type ComponentType } from 'react';

/** A lazily loaded component (see lazyNamed) and the fetch of its code, to start it ahead of the first render. */
// eslint-disable-next-line @typescript-eslint/no-explicit-any -- any props: the component keeps its own
export type LazyNamed<C extends ComponentType<any>> = ComponentType<ComponentProps<C>> & { preload: () => Promise<unknown> };

/**
 * A component exported by name from a module that is loaded on first render (or on `preload()`). A
 * feature's index.ts uses it for the panels and pages that need not be in the main script, so that a
 * board's canvas draws before their code is fetched and run; render it inside a Suspense boundary. Once
 * the code is loaded, a new instance renders the component itself at once, without suspending.
 */
// eslint-disable-next-line @typescript-eslint/no-explicit-any -- any props: the component keeps its own
export function lazyNamed<M extends Record<K, ComponentType<any>>, K extends keyof M>(load: () => Promise<M>, name: K): LazyNamed<M[K]> {
  let loaded: M[K] | undefined;
  let pending: Promise<M> | undefined;
  const makeLazy = () => lazy(() => preload().then((m) => ({ default: m[name] })));
  // React.lazy keeps a failed load for good: after a failure (offline) the next instance gets a new one,
  // which asks for the code again (see ChunkBoundary, which remounts its children to retry)
  let Lazy = makeLazy();
  const preload = () => {
    pending ??= load().then(
      (m) => { loaded = m[name]; return m; },
      (err: unknown) => { pending = undefined; Lazy = makeLazy(); throw err; },
    );
    return pending;
  };
  function LazyNamedComponent(props: ComponentProps<M[K]>) {
    // chosen once per instance: switching from the lazy wrapper to the component would remount it
    const [Component] = useState<ComponentType<ComponentProps<M[K]>>>(() => (loaded ?? Lazy) as ComponentType<ComponentProps<M[K]>>);
    return <Component {...props} />;
  }
  LazyNamedComponent.displayName = `Lazy(${String(name)})`;
  return Object.assign(LazyNamedComponent, { preload });
}
