//! Deflates the PDF's streams at a fast level.
//!
//! printpdf compresses every stream at flate's best level, which was most of the demo report's writing
//! time; the fast level costs a few per cent more bytes and a fraction of the time (docs/speed.md).
//! Same rule as printpdf's otherwise: only streams that allow compression and have no filter yet, and a
//! stream is kept plain when deflating would not make it shorter.

use std::io::Write;

use flate2::write::ZlibEncoder;
use flate2::Compression;
use lopdf::{Document, Object, Stream};

use crate::ScheduleError;

/// Bytes a deflated stream's dictionary grows by (`/Filter /FlateDecode`, with its space): below this
/// saving the stream stays plain.
const FILTER_ENTRY_BYTES: usize = 19;

/// Deflates every compressible, unfiltered stream of `document` at [`Compression::fast`].
pub(crate) fn compress_streams(document: &mut Document) -> Result<(), ScheduleError> {
    for object in document.objects.values_mut() {
        if let Object::Stream(stream) = object {
            compress_stream(stream)?;
        }
    }
    Ok(())
}

fn compress_stream(stream: &mut Stream) -> Result<(), ScheduleError> {
    if !stream.allows_compression || stream.dict.get(b"Filter").is_ok() {
        return Ok(());
    }
    let mut encoder = ZlibEncoder::new(
        Vec::with_capacity(stream.content.len() / 2),
        Compression::fast(),
    );
    let deflated = encoder
        .write_all(&stream.content)
        .and_then(|()| encoder.finish())
        .map_err(|error| ScheduleError::Pdf(format!("deflating a stream: {error}")))?;
    if deflated.len() + FILTER_ENTRY_BYTES < stream.content.len() {
        stream.dict.set("Filter", "FlateDecode");
        stream.set_content(deflated);
    }
    Ok(())
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
