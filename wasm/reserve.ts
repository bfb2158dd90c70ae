// Bump allocator over a module's own memory; the host lays out its arrays once.
let top: usize = 0;

export function reserve(bytes: i32): usize {
  if (top == 0) top = (__heap_base + 15) & ~15;
  const p = top;
  top = (top + <usize>bytes + 15) & ~15;
  const need = <i32>((top + 0xffff) >> 16) - memory.size();
  if (need > 0) memory.grow(need);
  return p;
}
