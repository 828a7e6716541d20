import { STACK_CONFIGURATION } from 'wick-core';

/** The editor page of a saved variant: the stack editor for a stack, the layer editor otherwise. */
export function variantRoute(v: { readonly id: number; readonly configuration: string }): (string | number)[] {
  return v.configuration === STACK_CONFIGURATION ? ['/designs/stacks', v.id] : ['/designs/variants', v.id];
}
