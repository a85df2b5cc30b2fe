//! Deflates the PDF's streams at a fast level.
//!
//! printpdf compresses every stream at flate's best level, which was most of the demo report's writing
//! time; the fast level costs a few per cent more bytes and a fraction of the time (docs/speed.md).
//! Same rule as printpdf's otherwise: only streams that allow compression and have no filter yet, and a
//! stream is kept plain when deflating would not make it shorter.

use flate2::{Compress, Compression, FlushCompress, Status};
use lopdf::{Document, Object, Stream};

use crate::ScheduleError;

/// Bytes a deflated stream's dictionary grows by (`/Filter /FlateDecode`, with its space): below this
/// saving the stream stays plain.
const FILTER_ENTRY_BYTES: usize = 19;

/// Deflates every compressible, unfiltered stream of `document` at [`Compression::fast`], with one
/// compressor reset between streams (setting one up costs more than deflating a page).
pub(crate) fn compress_streams(document: &mut Document) -> Result<(), ScheduleError> {
    let mut compressor = Compress::new(Compression::fast(), true);
    for object in document.objects.values_mut() {
        if let Object::Stream(stream) = object {
            compress_stream(stream, &mut compressor)?;
        }
    }
    Ok(())
}

fn compress_stream(stream: &mut Stream, compressor: &mut Compress) -> Result<(), ScheduleError> {
    if !stream.allows_compression || stream.dict.get(b"Filter").is_ok() {
        return Ok(());
    }
    let deflated = zlib(compressor, &stream.content)?;
    if deflated.len() + FILTER_ENTRY_BYTES < stream.content.len() {
        stream.dict.set("Filter", "FlateDecode");
        stream.set_content(deflated);
    }
    Ok(())
}

/// `input` as one zlib stream (RFC 1950), from a fresh start of `compressor`.
fn zlib(compressor: &mut Compress, input: &[u8]) -> Result<Vec<u8>, ScheduleError> {
    let fail = |what: String| ScheduleError::Pdf(format!("deflating a stream: {what}"));
    compressor.reset();
    let mut output = Vec::with_capacity(input.len() / 2 + 64);
    let mut last_progress = None;
    loop {
        let progress = (compressor.total_in(), compressor.total_out());
        if last_progress == Some(progress) && output.capacity() - output.len() >= 64 {
            return Err(fail("the compressor made no progress".to_string()));
        }
        last_progress = Some(progress);
        let read = usize::try_from(compressor.total_in()).map_err(|e| fail(e.to_string()))?;
        let rest = input
            .get(read..)
            .ok_or_else(|| fail("read past the end".to_string()))?;
        if output.capacity() - output.len() < 64 {
            output.reserve(output.capacity().max(1024));
        }
        match compressor
            .compress_vec(rest, &mut output, FlushCompress::Finish)
            .map_err(|e| fail(e.to_string()))?
        {
            Status::StreamEnd => return Ok(output),
            Status::Ok | Status::BufError => {}
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use lopdf::Dictionary;

    fn document_with(stream: Stream) -> (Document, lopdf::ObjectId) {
        let mut document = Document::with_version("1.3");
        let id = document.add_object(Object::Stream(stream));
        (document, id)
    }

    fn stream_of(document: &Document, id: lopdf::ObjectId) -> &Stream {
        match document.get_object(id) {
            Ok(Object::Stream(stream)) => stream,
            other => panic!("not a stream: {other:?}"),
        }
    }

    #[test]
    fn a_long_stream_is_deflated_and_inflates_back_to_its_content() {
        let content = b"0 0 m 10 10 l S\n".repeat(200);
        let (mut document, id) = document_with(Stream::new(Dictionary::new(), content.clone()));
        compress_streams(&mut document).expect("deflates");
        let stream = stream_of(&document, id);
        assert!(stream.content.len() < content.len() / 4);
        assert_eq!(stream.decompressed_content().expect("inflates"), content);
    }

    #[test]
    fn streams_deflated_one_after_another_each_inflate_to_their_own_content() {
        // Incompressible bytes (a fixed xorshift sequence) larger than the first output buffer, then text.
        let mut state = 0x2545_f491_u32;
        let noise: Vec<u8> = (0..300_000)
            .map(|_| {
                state ^= state << 13;
                state ^= state >> 17;
                state ^= state << 5;
                state as u8
            })
            .collect();
        let text = b"BT /F5 9 Tf (line) Tj ET\n".repeat(500);
        let mut document = Document::with_version("1.3");
        let first = document.add_object(Object::Stream(Stream::new(
            Dictionary::new(),
            noise.clone(),
        )));
        let second =
            document.add_object(Object::Stream(Stream::new(Dictionary::new(), text.clone())));
        compress_streams(&mut document).expect("deflates");
        assert_eq!(
            stream_of(&document, first).content,
            noise,
            "noise stays plain"
        );
        let second = stream_of(&document, second);
        assert!(second.content.len() < text.len() / 10);
        assert_eq!(second.decompressed_content().expect("inflates"), text);
    }

    #[test]
    fn a_short_stream_stays_plain() {
        let content = b"0 0 m S".to_vec();
        let (mut document, id) = document_with(Stream::new(Dictionary::new(), content.clone()));
        compress_streams(&mut document).expect("deflates");
        let stream = stream_of(&document, id);
        assert!(stream.dict.get(b"Filter").is_err());
        assert_eq!(stream.content, content);
    }

    #[test]
    fn a_filtered_or_uncompressible_stream_is_left_alone() {
        let content = b"0 0 m 10 10 l S\n".repeat(200);
        let mut filtered = Dictionary::new();
        filtered.set("Filter", "DCTDecode");
        let (mut document, id) = document_with(Stream::new(filtered, content.clone()));
        let fixed = document.add_object(Object::Stream(
            Stream::new(Dictionary::new(), content.clone()).with_compression(false),
        ));
        compress_streams(&mut document).expect("deflates");
        assert_eq!(stream_of(&document, id).content, content);
        assert_eq!(stream_of(&document, fixed).content, content);
    }
}
