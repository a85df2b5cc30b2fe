//! Where `summary.csv` goes: standard output, or a temporary file in the output folder that is renamed
//! into place only when every row has been written (a batch stopped half-way leaves no summary that
//! looks complete).

use anyhow::{Context, Result};
use std::fs::{self, File};
use std::io::{self, BufWriter, Write};
use std::path::{Path, PathBuf};

/// File name of the summary in the output folder.
pub const SUMMARY_FILE: &str = "summary.csv";

/// The summary being written.
#[derive(Debug)]
pub enum SummarySink {
    Stdout(BufWriter<io::Stdout>),
    File {
        writer: BufWriter<File>,
        partial: PathBuf,
        path: PathBuf,
    },
}

impl SummarySink {
    /// Into `folder`/summary.csv when a folder is given, else standard output.
    pub fn open(folder: Option<&Path>) -> Result<Self> {
        let Some(folder) = folder else {
            return Ok(SummarySink::Stdout(BufWriter::new(io::stdout())));
        };
        fs::create_dir_all(folder)
            .with_context(|| format!("cannot create the output folder {}", folder.display()))?;
        let path = folder.join(SUMMARY_FILE);
        let partial = folder.join(format!(".{SUMMARY_FILE}.partial"));
        let file = File::create(&partial)
            .with_context(|| format!("cannot create {}", partial.display()))?;
        Ok(SummarySink::File {
            writer: BufWriter::new(file),
            partial,
            path,
        })
    }

    pub fn write(&mut self, bytes: &[u8]) -> Result<()> {
        match self {
            SummarySink::Stdout(writer) => writer.write_all(bytes),
            SummarySink::File { writer, .. } => writer.write_all(bytes),
        }
        .context("cannot write the summary")
    }

    /// Flushes, and moves the file into place. Returns the summary's path (None for standard output).
    pub fn finish(self) -> Result<Option<PathBuf>> {
        match self {
            SummarySink::Stdout(mut writer) => {
                writer.flush().context("cannot write the summary")?;
                Ok(None)
            }
            SummarySink::File {
                writer,
                partial,
                path,
            } => {
                let file = writer
                    .into_inner()
                    .map_err(|error| error.into_error())
                    .with_context(|| format!("cannot write {}", partial.display()))?;
                file.sync_all()
                    .with_context(|| format!("cannot write {}", partial.display()))?;
                fs::rename(&partial, &path)
                    .with_context(|| format!("cannot move the summary into {}", path.display()))?;
                Ok(Some(path))
            }
        }
    }
}
