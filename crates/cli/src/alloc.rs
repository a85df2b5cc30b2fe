//! The binary's allocator: mimalloc, asked for plain blocks where the layout allows it.
//!
//! mimalloc in place of the system allocator: the PDF writer and the batch make many small short-lived
//! vectors, and glibc's malloc and free were about a quarter of their time (docs/speed.md). The
//! `mimalloc` crate's own wrapper calls `mi_malloc_aligned` for every allocation, whose alignment
//! checks made an allocation cost about half as much again as the plain call (a batch of 100 roofs:
//! 11.4M instructions in `__rust_alloc` with it, 7.0M without); nearly every layout the program asks
//! for (vectors of numbers, strings) has an alignment mimalloc's plain `mi_malloc` already gives, so
//! this wrapper calls that and keeps the aligned calls for the rest.

#![allow(unsafe_code)]

use std::alloc::{GlobalAlloc, Layout};
use std::ffi::c_void;

use libmimalloc_sys::{
    mi_free, mi_malloc, mi_malloc_aligned, mi_realloc, mi_realloc_aligned, mi_zalloc,
    mi_zalloc_aligned,
};

/// The alignment every block of `mi_malloc` has once its size reaches it: `MI_MAX_ALIGN_SIZE` in
/// mimalloc's `types.h` (16 on every platform we build for). A block of 16 bytes or more is aligned to
/// 16, a smaller one (8 bytes) to 8; std's own `System` allocator takes malloc the same way, with the
/// same test ([`plain_suffices`]).
const PLAIN_ALIGN: usize = 16;

/// A block of `size` bytes from the plain calls is aligned enough for `align`: the alignment is one
/// they always give, and no larger than the size (an 8-byte block is aligned only to 8).
fn plain_suffices(align: usize, size: usize) -> bool {
    align <= PLAIN_ALIGN && align <= size
}

/// mimalloc through its plain calls when they give the alignment, its aligned calls otherwise.
#[derive(Debug)]
pub struct Allocator;

// SAFETY: every block comes from mimalloc and goes back to it (`mi_free` takes blocks from any of its
// calls); each block is aligned as the layout asks: the plain calls only where `plain_suffices` (see
// PLAIN_ALIGN), the aligned calls for the rest. mimalloc returns null when out of memory, as the trait
// asks.
unsafe impl GlobalAlloc for Allocator {
    #[inline]
    unsafe fn alloc(&self, layout: Layout) -> *mut u8 {
        // SAFETY: mimalloc's calls take any size and a power-of-two alignment (a Layout's).
        unsafe {
            if plain_suffices(layout.align(), layout.size()) {
                mi_malloc(layout.size()).cast()
            } else {
                mi_malloc_aligned(layout.size(), layout.align()).cast()
            }
        }
    }

    #[inline]
    unsafe fn alloc_zeroed(&self, layout: Layout) -> *mut u8 {
        // SAFETY: as in `alloc`.
        unsafe {
            if plain_suffices(layout.align(), layout.size()) {
                mi_zalloc(layout.size()).cast()
            } else {
                mi_zalloc_aligned(layout.size(), layout.align()).cast()
            }
        }
    }

    #[inline]
    unsafe fn dealloc(&self, ptr: *mut u8, _layout: Layout) {
        // SAFETY: the caller gives back a block this allocator gave, so one of mimalloc's.
        unsafe { mi_free(ptr.cast::<c_void>()) }
    }

    #[inline]
    unsafe fn realloc(&self, ptr: *mut u8, layout: Layout, new_size: usize) -> *mut u8 {
        // SAFETY: `ptr` is one of mimalloc's blocks (the caller's promise); the new block is aligned
        // as the layout asks, by the same test as `alloc` on its new size.
        unsafe {
            if plain_suffices(layout.align(), new_size) {
                mi_realloc(ptr.cast::<c_void>(), new_size).cast()
            } else {
                mi_realloc_aligned(ptr.cast::<c_void>(), new_size, layout.align()).cast()
            }
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    /// Allocates, grows and frees blocks of many sizes and alignments and checks each is aligned.
    #[test]
    fn every_block_is_aligned_as_its_layout_asks() {
        let allocator = Allocator;
        for align in [1usize, 2, 4, 8, 16, 32, 64, 4096] {
            for size in [1usize, 3, 8, 12, 16, 24, 40, 100, 1000, 70_000] {
                let Ok(layout) = Layout::from_size_align(size, align) else {
                    continue;
                };
                // SAFETY: the layout has a non-zero size; each block is freed once with its layout.
                unsafe {
                    let block = allocator.alloc(layout);
                    assert!(!block.is_null());
                    assert_eq!(block as usize % align, 0, "size {size} align {align}");
                    block.write_bytes(7, size);
                    let grown = allocator.realloc(block, layout, size * 3);
                    assert_eq!(grown as usize % align, 0, "grown {size} align {align}");
                    assert_eq!(grown.add(size - 1).read(), 7);
                    allocator.dealloc(grown, Layout::from_size_align_unchecked(size * 3, align));
                    let zeroed = allocator.alloc_zeroed(layout);
                    assert_eq!(zeroed as usize % align, 0);
                    assert_eq!(zeroed.add(size - 1).read(), 0);
                    allocator.dealloc(zeroed, layout);
                }
            }
        }
    }
}
