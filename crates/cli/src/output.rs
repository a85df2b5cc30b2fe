//! Writing result files: each to a temporary file in the same folder, then renamed into place, so a failed
//! run never leaves a half-written schedule behind.

use anyhow::{Context, Result};
use std::fs;
use std::io::Write;
use std::path::{Path, PathBuf};

/// Writes every `(file name, bytes)` into `folder`. All files are written to temporaries first and renamed
/// only when every one of them was written.
pub fn write_all_atomically(folder: &Path, files: &[(&str, Vec<u8>)]) -> Result<Vec<PathBuf>> {
    fs::create_dir_all(folder)
        .with_context(|| format!("cannot create the output folder {}", folder.display()))?;
    let mut staged = Vec::new();
    for (name, bytes) in files {
        let final_path = folder.join(name);
        let temporary_path = folder.join(format!(".{name}.partial"));
        let written = fs::File::create(&temporary_path)
            .and_then(|mut file| file.write_all(bytes).and_then(|()| file.sync_all()));
        if let Err(error) = written {
            for (temporary, _) in &staged {
                let _ = fs::remove_file(temporary);
            }
            let _ = fs::remove_file(&temporary_path);
            return Err(error)
                .with_context(|| format!("cannot write {}", temporary_path.display()));
        }
        staged.push((temporary_path, final_path));
    }
    let mut written_paths = Vec::new();
    for (temporary, final_path) in staged {
        fs::rename(&temporary, &final_path)
            .with_context(|| format!("cannot move the result into {}", final_path.display()))?;
        written_paths.push(final_path);
    }
    Ok(written_paths)
}

/// Writes one new file, refusing to overwrite an existing one.
pub fn write_new_file(path: &Path, bytes: &[u8]) -> Result<()> {
    let mut file = fs::OpenOptions::new()
        .write(true)
        .create_new(true)
        .open(path)
        .with_context(|| {
            format!(
                "cannot create {} (an existing file is never overwritten)",
                path.display()
            )
        })?;
    file.write_all(bytes)
        .with_context(|| format!("cannot write {}", path.display()))
}
