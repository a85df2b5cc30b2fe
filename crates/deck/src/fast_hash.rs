//! A small multiplicative hasher for the deck's caches, whose keys are plain integers (rounded
//! lengths, float bits, zone numbers). std's default hasher guards against crafted keys, which these
//! are not, and cost more than the loads and strip solutions it looked up. No cache is ever iterated,
//! so the hash order never reaches the output.

use std::hash::{BuildHasherDefault, Hasher};

#[derive(Debug, Default, Clone, Copy)]
pub(crate) struct FastHasher(u64);

impl Hasher for FastHasher {
    fn finish(&self) -> u64 {
        self.0
    }

    /// Eight bytes at a time: a slice of integers (a strip's rounded spans) is hashed as its bytes.
    fn write(&mut self, bytes: &[u8]) {
        let mut words = bytes.chunks_exact(8);
        for word in &mut words {
            let mut eight = [0u8; 8];
            eight.copy_from_slice(word);
            self.write_u64(u64::from_le_bytes(eight));
        }
        for byte in words.remainder() {
            self.write_u64(u64::from(*byte));
        }
    }

    fn write_u64(&mut self, value: u64) {
        self.0 = (self.0.rotate_left(5) ^ value).wrapping_mul(0x517c_c1b7_2722_0a95);
    }

    fn write_usize(&mut self, value: usize) {
        self.write_u64(value as u64);
    }
}

pub(crate) type BuildFastHasher = BuildHasherDefault<FastHasher>;

#[cfg(test)]
mod tests {
    use super::*;
    use std::hash::{BuildHasher, Hash};

    fn hash_of(key: impl Hash) -> u64 {
        BuildFastHasher::default().hash_one(key)
    }

    #[test]
    fn keys_that_differ_in_any_word_hash_differently() {
        let spans = [6_100_000_000_i64, 6_100_000_000, 2_000_000_000];
        let mut moved = spans;
        moved[2] += 1;
        assert_ne!(hash_of(spans.as_slice()), hash_of(moved.as_slice()));
        assert_ne!(hash_of(&spans[..2]), hash_of(spans.as_slice()));
        assert_eq!(hash_of(spans.as_slice()), hash_of(spans.to_vec()));
    }
}
