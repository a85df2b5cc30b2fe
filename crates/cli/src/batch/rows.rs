//! Reading a batch file a chunk of rows at a time, so memory does not grow with the number of rows.

use anyhow::{bail, Context, Result};
use std::collections::hash_map::{Entry, HashMap};
use std::hash::{DefaultHasher, Hash, Hasher};
use std::io::Read;

use deckhold_project::batch::{Columns, ID_COLUMN};

/// Rows read and worked at once: enough to keep every core busy, small enough that a chunk's rows and
/// summaries take a few megabytes.
pub const CHUNK_ROWS: usize = 2048;

use deckhold_core::limits::{BATCH_FIELD_CHARS, BATCH_ROWS};

/// One row as read: its spreadsheet row number (the header is row 1) and its fields.
#[derive(Debug)]
pub struct OwnedRow {
    pub number: u64,
    pub record: csv::StringRecord,
    /// Why the row is refused before it is worked (a repeated id, an overlong field): the column's name
    /// and the message.
    pub problem: Option<(String, String)>,
}

/// The batch file being read.
pub struct RowReader<R: Read> {
    reader: csv::Reader<R>,
    pub columns: Columns,
    header: csv::StringRecord,
    rows_read: u64,
    chunk_rows: usize,
    /// A 128-bit hash of each id seen, with its row number: ids are only compared, never printed back, so
    /// the hash is enough (a collision among a million ids has a chance of about 1 in 10^26).
    seen_ids: HashMap<u128, u64>,
}

impl<R: Read> std::fmt::Debug for RowReader<R> {
    fn fmt(&self, formatter: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        formatter
            .debug_struct("RowReader")
            .field("columns", &self.columns)
            .field("rows_read", &self.rows_read)
            .finish()
    }
}

fn id_hash(id: &str) -> u128 {
    let half = |salt: u8| {
        let mut hasher = DefaultHasher::new();
        salt.hash(&mut hasher);
        id.hash(&mut hasher);
        hasher.finish()
    };
    (u128::from(half(1)) << 64) | u128::from(half(2))
}

impl<R: Read> RowReader<R> {
    /// Reads the header; refuses the batch when it is not a valid header. Rows then come
    /// `chunk_rows` at a time ([`CHUNK_ROWS`] in the program).
    pub fn new(source: R, chunk_rows: usize) -> Result<Self> {
        let mut reader = csv::ReaderBuilder::new()
            .flexible(true)
            .has_headers(true)
            .from_reader(source);
        let header = reader
            .headers()
            .context("cannot read the header row of the batch file")?
            .clone();
        let columns = Columns::from_header(header.iter())?;
        Ok(RowReader {
            reader,
            columns,
            header,
            rows_read: 0,
            chunk_rows: chunk_rows.max(1),
            seen_ids: HashMap::new(),
        })
    }

    /// Bytes read so far, for the progress bar.
    pub fn byte_offset(&self) -> u64 {
        self.reader.position().byte()
    }

    /// A field longer than any project-file value, or an id an earlier row already used.
    fn problem_of(&mut self, record: &csv::StringRecord, number: u64) -> Option<(String, String)> {
        if let Some(index) = record
            .iter()
            .position(|field| field.chars().count() > BATCH_FIELD_CHARS.max_count())
        {
            let column = self
                .header
                .get(index)
                .map_or_else(|| format!("{}", index + 1), str::to_string);
            return Some((
                column,
                format!(
                    "the field is longer than {} characters",
                    BATCH_FIELD_CHARS.max
                ),
            ));
        }
        let id = record.get(self.columns.id_index).unwrap_or("").trim();
        if id.is_empty() {
            return None;
        }
        match self.seen_ids.entry(id_hash(id)) {
            Entry::Occupied(first) => Some((
                ID_COLUMN.to_string(),
                format!("the id '{id}' is already used by row {}", first.get()),
            )),
            Entry::Vacant(slot) => {
                slot.insert(number);
                None
            }
        }
    }

    /// The next chunk of rows (empty at the end of the file).
    pub fn next_chunk(&mut self) -> Result<Vec<OwnedRow>> {
        let mut chunk = Vec::with_capacity(self.chunk_rows);
        while chunk.len() < self.chunk_rows {
            let mut record = csv::StringRecord::new();
            let more = self.reader.read_record(&mut record).with_context(|| {
                format!("cannot read row {} of the batch file", self.rows_read + 2)
            })?;
            if !more {
                break;
            }
            self.rows_read += 1;
            if self.rows_read > BATCH_ROWS.max as u64 {
                bail!(
                    "the batch file has more than {} rows; split it into several files",
                    BATCH_ROWS.max
                );
            }
            let number = self.rows_read + 1;
            let problem = self.problem_of(&record, number);
            chunk.push(OwnedRow {
                number,
                record,
                problem,
            });
        }
        Ok(chunk)
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn rows_are_numbered_as_a_spreadsheet_shows_them_and_repeated_ids_found() {
        let text = "id,roof.shape\na,hip\nb,gable\na,flat\n";
        let mut reader = RowReader::new(text.as_bytes(), 2).expect("header");
        let first = reader.next_chunk().expect("rows");
        let second = reader.next_chunk().expect("rows");
        let numbers: Vec<u64> = first.iter().chain(&second).map(|row| row.number).collect();
        assert_eq!(
            numbers,
            [2, 3, 4],
            "rows in order across the chunk boundary"
        );
        let (column, message) = second[0].problem.clone().expect("a repeat across chunks");
        assert_eq!(column, "id");
        assert_eq!(message, "the id 'a' is already used by row 2");
        assert_eq!(first[1].problem, None);
        assert!(reader.next_chunk().expect("end").is_empty());
    }

    #[test]
    fn an_overlong_field_refuses_its_row_only() {
        let text = format!("id,project.notes\na,{}\nb,short\n", "x".repeat(2001));
        let mut reader = RowReader::new(text.as_bytes(), CHUNK_ROWS).expect("header");
        let rows = reader.next_chunk().expect("rows");
        let (column, message) = rows[0].problem.clone().expect("too long");
        assert_eq!(column, "project.notes");
        assert!(message.contains("longer than 2000"), "{message}");
        assert_eq!(rows[1].problem, None);
    }

    #[test]
    fn a_header_without_id_refuses_the_batch() {
        let error = RowReader::new("name,roof.shape\n".as_bytes(), CHUNK_ROWS).expect_err("no id");
        assert!(format!("{error:#}").contains("no 'id' column"));
    }
}
