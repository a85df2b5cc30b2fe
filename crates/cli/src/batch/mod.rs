//! The batch runner's parts: the chunked row reader, the per-row work, the ordered summary sink.
//!
//! Rows are read a chunk at a time ([`rows`]), worked in parallel on a rayon pool ([`work`]), and their
//! summary lines written in input order ([`sink`]); a chunk is finished before the next is read, so
//! memory is bounded by the chunk size whatever the number of rows, and the bytes written do not depend
//! on the number of threads.

pub mod rows;
pub mod sink;
pub mod work;
