//! Writing result files as sets: all or nothing per set. The layout is documented in docs/output-sets.md.
//!
//! Each command owns one set of names in the output folder ([`OutputSet`]): `run` the schedule files,
//! `check` the plan-check report, `compare` the comparison. A command replaces only its own set, so a
//! `check --out` into a folder holding a `run --out` schedule leaves the schedule as it was.
//!
//! On Unix the files of one set live in a generation directory `DIR/.deckhold/<set>/gen-<id>/`; the
//! symbolic link `DIR/.deckhold/<set>/current` names the generation in force, and each visible name
//! (`DIR/schedule.csv`, ...) is a link to `.deckhold/<set>/current/<name>`. A new set is written whole into
//! a fresh generation directory, synced, then made visible by renaming one new link over the set's
//! `current`: a single atomic step (the visible links are made before it, so a first run's names appear
//! together). So after a kill at any instant every visible name of a set shows the previous set or the
//! new one, never a mix. Runs take an exclusive lock on `DIR/.deckhold/lock` while they
//! write and swap, so concurrent runs each leave a whole set, and a run removes what killed runs of its own
//! set left behind (`gen-*`, `next-*`, `link-*`) under that lock.
//!
//! Nothing is followed that deckhold did not create: an entry found where deckhold writes must be either
//! absent, a regular file (an older output, replaced by a link), or exactly the link deckhold makes; anything
//! else is refused with a message. Files the tool does not name, and the names of the other sets, are never
//! touched.

use anyhow::{bail, Context, Result};
use std::fs;
use std::io::Write;
use std::path::{Path, PathBuf};

/// The sets of files a command writes into an output folder; each replaces only its own names.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum OutputSet {
    /// `run --out` (and each roof's folder of `batch --pdf`): the sheathing fastening schedule.
    Schedule,
    /// `check --out`: the plan-check report.
    Check,
    /// `compare --out`: the nails side by side.
    Compare,
}

impl OutputSet {
    /// Every set, for checks that their names never overlap.
    pub const ALL: [OutputSet; 3] = [OutputSet::Schedule, OutputSet::Check, OutputSet::Compare];

    /// The set's folder under `.deckhold/`.
    pub fn key(self) -> &'static str {
        match self {
            OutputSet::Schedule => "schedule",
            OutputSet::Check => "check",
            OutputSet::Compare => "compare",
        }
    }

    /// Every name the set may write (one write is a subset: `schedule.json` only with `--json`).
    pub fn names(self) -> &'static [&'static str] {
        match self {
            OutputSet::Schedule => &[
                "schedule.csv",
                "rafter-lines.csv",
                "schedule.pdf",
                "schedule.json",
            ],
            OutputSet::Check => &["check.csv", "check.pdf"],
            OutputSet::Compare => &["compare.csv", "compare.pdf"],
        }
    }
}

/// The folder beside the outputs where generations live.
pub const STATE_DIR: &str = ".deckhold";

/// Writes every `(file name, bytes)` of `set` into `folder` as one set and returns the visible paths.
/// Names of other sets in the folder are left as they are.
pub fn write_all_atomically(
    folder: &Path,
    set: OutputSet,
    files: &[(&str, Vec<u8>)],
) -> Result<Vec<PathBuf>> {
    for (name, _) in files {
        if !set.names().contains(name) {
            bail!(
                "internal: {name} is not one of the {} set's names",
                set.key()
            );
        }
    }
    fs::create_dir_all(folder)
        .with_context(|| format!("cannot create the output folder {}", folder.display()))?;
    if !fs::metadata(folder)
        .with_context(|| format!("cannot read {}", folder.display()))?
        .is_dir()
    {
        bail!("{} is not a folder: give --out a folder", folder.display());
    }
    platform::write_set(folder, set, files)
}

/// Writes one new file, refusing to overwrite an existing one.
pub fn write_new_file(path: &Path, bytes: &[u8]) -> Result<()> {
    fill_and_sync(create_new_file(path)?, path, bytes)
}

/// Creates `path`, refusing an existing entry.
fn create_new_file(path: &Path) -> Result<fs::File> {
    fs::OpenOptions::new()
        .write(true)
        .create_new(true)
        .open(path)
        .with_context(|| {
            format!(
                "cannot create {} (an existing file is never overwritten)",
                path.display()
            )
        })
}

/// Writes `bytes` into the new `file` (at `path`) and waits until they are on the disk.
fn fill_and_sync(mut file: fs::File, path: &Path, bytes: &[u8]) -> Result<()> {
    file.write_all(bytes)
        .and_then(|()| file.sync_all())
        .with_context(|| format!("cannot write {}", path.display()))
}

/// A name no other process or earlier run will pick: process id, time and a counter.
fn unique_suffix() -> String {
    use std::sync::atomic::{AtomicU64, Ordering};
    static COUNTER: AtomicU64 = AtomicU64::new(0);
    let nanos = std::time::SystemTime::now()
        .duration_since(std::time::UNIX_EPOCH)
        .map_or(0, |elapsed| elapsed.as_nanos());
    format!(
        "{}-{nanos}-{}",
        std::process::id(),
        COUNTER.fetch_add(1, Ordering::Relaxed)
    )
}

#[cfg(unix)]
mod platform {
    use super::{create_new_file, fill_and_sync, unique_suffix, OutputSet, STATE_DIR};
    use anyhow::{bail, Context, Result};
    use rustix::fs::{flock, FlockOperation};
    use std::fs;
    use std::io::ErrorKind;
    use std::os::unix::fs::{symlink, OpenOptionsExt};
    use std::path::{Path, PathBuf};

    const CURRENT: &str = "current";

    /// The link target of a visible name: always the same, so the links never change once made.
    fn visible_target(set: OutputSet, name: &str) -> PathBuf {
        Path::new(STATE_DIR)
            .join(set.key())
            .join(CURRENT)
            .join(name)
    }

    /// The link target an earlier deckhold made, when every command shared one `.deckhold/current`.
    fn legacy_target(name: &str) -> PathBuf {
        Path::new(STATE_DIR).join(CURRENT).join(name)
    }

    pub fn write_set(
        folder: &Path,
        set: OutputSet,
        files: &[(&str, Vec<u8>)],
    ) -> Result<Vec<PathBuf>> {
        let state = folder.join(STATE_DIR);
        ensure_state_dir(&state)?;
        let lock_path = state.join("lock");
        let lock = fs::OpenOptions::new()
            .create(true)
            .truncate(false)
            .write(true)
            .custom_flags(rustix::fs::OFlags::NOFOLLOW.bits() as i32)
            .open(&lock_path)
            .with_context(|| format!("cannot open the lock file {}", lock_path.display()))?;
        flock(&lock, FlockOperation::LockExclusive)
            .with_context(|| format!("cannot lock {}", lock_path.display()))?;
        // From here on no other deckhold run writes in this folder until the lock is dropped.
        for (name, _) in files {
            check_visible_name(folder, set, name)?;
        }
        let set_state = state.join(set.key());
        ensure_state_dir(&set_state)?;
        let current = set_state.join(CURRENT);
        let mut previous = current_generation(&current)?;
        take_over_earlier_layout(folder, &set_state, set, files, &mut previous)?;

        let generation = format!("gen-{}", unique_suffix());
        let generation_path = set_state.join(&generation);
        fs::create_dir(&generation_path)
            .with_context(|| format!("cannot create {}", generation_path.display()))?;
        fault_point();
        // The generation replaced by the last run and what killed runs left are removed while the new
        // files are written: removing files waits on the disk as writing them does.
        let keep: Vec<&str> = previous
            .iter()
            .map(String::as_str)
            .chain([generation.as_str()])
            .collect();
        std::thread::scope(|scope| {
            let cleanup = scope.spawn(|| remove_leftovers(&set_state, &keep));
            let written = write_generation(&generation_path, files);
            let cleaned = cleanup
                .join()
                .unwrap_or_else(|_| bail!("a thread removing an earlier generation stopped"));
            written.and(cleaned)
        })?;
        fault_point();

        // Each name of the new set is linked before the swap. A link names `current`, not a generation,
        // so a name new to the folder shows nothing until the swap, and a name there already shows the
        // earlier set until then: the first run into a folder shows its whole set at once too.
        let mut written = Vec::new();
        let mut folder_changed = false;
        for name in set.names() {
            if files.iter().any(|(file, _)| file == name) {
                folder_changed |= make_visible_link(folder, &set_state, set, name)?;
                fault_point();
                written.push(folder.join(name));
            }
        }
        // The links reach the disk before the swap that makes them show the new set.
        if folder_changed {
            sync_dir(folder)?;
        }

        // The one step that makes the new set visible.
        swap_current(&set_state, &generation)?;

        // A name of an earlier set that this one lacks (schedule.json without --json) shows nothing
        // since the swap; its link goes.
        let mut removed = false;
        for name in set.names() {
            let path = folder.join(name);
            if !files.iter().any(|(file, _)| file == name) && is_our_link(&path, set, name)? {
                fs::remove_file(&path)
                    .with_context(|| format!("cannot remove {}", path.display()))?;
                removed = true;
            }
        }
        if removed {
            sync_dir(folder)?;
        }
        // The generation just replaced stays until the next run into this folder removes it, beside
        // its own writing: removing it here would add its wait to every run's.
        remove_legacy_state(folder, &state)?;
        drop(lock);
        Ok(written)
    }

    /// Points the set's `current` at `generation` in one rename, and syncs it.
    fn swap_current(set_state: &Path, generation: &str) -> Result<()> {
        let current = set_state.join(CURRENT);
        let next = set_state.join(format!("next-{}", unique_suffix()));
        symlink(generation, &next).with_context(|| format!("cannot create {}", next.display()))?;
        fs::rename(&next, &current)
            .with_context(|| format!("cannot swap in the new set at {}", current.display()))?;
        sync_dir(set_state)?;
        fault_point();
        Ok(())
    }

    /// A folder written by an earlier deckhold shows this set's names as plain files, or as links of the
    /// shared layout (one `.deckhold/current` for every command). Turning them into this layout's links
    /// one by one after the new set is in force would show a mix for a moment; so first the earlier files
    /// are adopted as a generation of their own (copied, made `current` in one rename), then each name
    /// becomes a link to `current`, which still shows the same earlier bytes. A kill at any step leaves
    /// every name showing the earlier set; the new set then comes in with the one swap of `current`.
    fn take_over_earlier_layout(
        folder: &Path,
        set_state: &Path,
        set: OutputSet,
        files: &[(&str, Vec<u8>)],
        previous: &mut Option<String>,
    ) -> Result<()> {
        let mut earlier = Vec::new();
        for (name, _) in files {
            let path = folder.join(name);
            let plain = fs::symlink_metadata(&path).is_ok_and(|meta| meta.file_type().is_file());
            let shared = fs::read_link(&path).is_ok_and(|target| target == legacy_target(name));
            if plain || shared {
                earlier.push(*name);
            }
        }
        if earlier.is_empty() {
            return Ok(());
        }
        if previous.is_none() {
            let adopted = format!("gen-{}", unique_suffix());
            let adopted_path = set_state.join(&adopted);
            fs::create_dir(&adopted_path)
                .with_context(|| format!("cannot create {}", adopted_path.display()))?;
            for name in &earlier {
                // A plain file, or the shared layout's link (deckhold's own, checked above): copied.
                fs::copy(folder.join(name), adopted_path.join(name))
                    .with_context(|| format!("cannot keep the earlier {name}"))?;
                fault_point();
            }
            sync_dir(&adopted_path)?;
            swap_current(set_state, &adopted)?;
            *previous = Some(adopted);
        }
        for name in &earlier {
            make_visible_link(folder, set_state, set, name)?;
            fault_point();
        }
        sync_dir(folder)
    }

    /// Test hook, debug builds only: with `DECKHOLD_FAULT_AFTER=N` the process aborts after the N-th step
    /// of writing a set, exactly as a kill at that instant would leave the folder. Release builds ignore it.
    fn fault_point() {
        #[cfg(debug_assertions)]
        {
            use std::sync::atomic::{AtomicUsize, Ordering};
            static STEPS: AtomicUsize = AtomicUsize::new(0);
            let step = STEPS.fetch_add(1, Ordering::SeqCst) + 1;
            let limit = std::env::var("DECKHOLD_FAULT_AFTER")
                .ok()
                .and_then(|text| text.parse::<usize>().ok());
            if limit == Some(step) {
                std::process::abort();
            }
        }
    }

    fn ensure_state_dir(state: &Path) -> Result<()> {
        match fs::symlink_metadata(state) {
            Ok(meta) if meta.file_type().is_dir() => Ok(()),
            Ok(_) => bail!(
                "{} is not the folder deckhold keeps its output sets in (it is a file or a link); \
                 remove it or choose another --out",
                state.display()
            ),
            Err(error) if error.kind() == ErrorKind::NotFound => match fs::create_dir(state) {
                Ok(()) => Ok(()),
                Err(error) if error.kind() == ErrorKind::AlreadyExists => ensure_state_dir(state),
                Err(error) => {
                    Err(error).with_context(|| format!("cannot create {}", state.display()))
                }
            },
            Err(error) => Err(error).with_context(|| format!("cannot read {}", state.display())),
        }
    }

    /// A visible name must be absent, a regular file (an earlier output) or the link deckhold makes.
    fn check_visible_name(folder: &Path, set: OutputSet, name: &str) -> Result<()> {
        let path = folder.join(name);
        match fs::symlink_metadata(&path) {
            Err(error) if error.kind() == ErrorKind::NotFound => Ok(()),
            Err(error) => Err(error).with_context(|| format!("cannot read {}", path.display())),
            Ok(meta) if meta.file_type().is_file() => Ok(()),
            Ok(_) if is_our_link(&path, set, name)? => Ok(()),
            Ok(meta) if meta.file_type().is_symlink() => bail!(
                "{} is a link deckhold did not make; it is never followed: remove it or choose another --out",
                path.display()
            ),
            Ok(_) => bail!(
                "{} is taken by something that is not a file (a folder or a device); deckhold writes its \
                 {name} there: remove it or choose another --out",
                path.display()
            ),
        }
    }

    /// Whether `path` is the link deckhold makes for `name`, in this layout or the earlier shared one.
    fn is_our_link(path: &Path, set: OutputSet, name: &str) -> Result<bool> {
        match fs::read_link(path) {
            Ok(target) => Ok(target == visible_target(set, name) || target == legacy_target(name)),
            Err(error) if matches!(error.kind(), ErrorKind::NotFound | ErrorKind::InvalidInput) => {
                Ok(false)
            }
            Err(error) => Err(error).with_context(|| format!("cannot read {}", path.display())),
        }
    }

    /// The generation `current` names, if it is deckhold's link; anything else there is refused.
    fn current_generation(current: &Path) -> Result<Option<String>> {
        match fs::symlink_metadata(current) {
            Err(error) if error.kind() == ErrorKind::NotFound => Ok(None),
            Err(error) => Err(error).with_context(|| format!("cannot read {}", current.display())),
            Ok(meta) if meta.file_type().is_symlink() => {
                let target = fs::read_link(current)
                    .with_context(|| format!("cannot read {}", current.display()))?;
                match target.to_str() {
                    Some(text) if is_generation_name(text) => Ok(Some(text.to_string())),
                    _ => bail!(
                        "{} points to {}, which is not a deckhold output set: remove it",
                        current.display(),
                        target.display()
                    ),
                }
            }
            Ok(_) => bail!(
                "{} is not a link deckhold made: remove it",
                current.display()
            ),
        }
    }

    fn is_generation_name(text: &str) -> bool {
        text.starts_with("gen-") && !text.contains('/') && text != "gen-"
    }

    /// Removes what runs killed part-way left in a set's folder: generations not in force, unused links.
    fn remove_leftovers(set_state: &Path, keep: &[&str]) -> Result<()> {
        let entries = fs::read_dir(set_state)
            .with_context(|| format!("cannot list {}", set_state.display()))?;
        for entry in entries {
            let entry = entry.with_context(|| format!("cannot list {}", set_state.display()))?;
            let name = entry.file_name();
            let Some(name) = name.to_str() else { continue };
            let stale = (is_generation_name(name) && !keep.contains(&name))
                || name.starts_with("next-")
                || name.starts_with("link-");
            if stale {
                remove_entry(&entry.path())?;
            }
        }
        Ok(())
    }

    /// An earlier deckhold kept one shared `.deckhold/current` for every command. Once no visible name
    /// links through it any more (each set rewritten in this layout), its generations and links go;
    /// until then they stay, so the names of a set not yet rewritten keep showing their files.
    fn remove_legacy_state(folder: &Path, state: &Path) -> Result<()> {
        let current = state.join(CURRENT);
        if fs::symlink_metadata(&current).is_err() {
            return Ok(());
        }
        for set in OutputSet::ALL {
            for name in set.names() {
                if let Ok(target) = fs::read_link(folder.join(name)) {
                    if target == legacy_target(name) {
                        return Ok(());
                    }
                }
            }
        }
        // A `current` that is not deckhold's link is not ours to remove.
        let Ok(keep) = current_generation(&current) else {
            return Ok(());
        };
        remove_entry(&current)?;
        if let Some(keep) = keep {
            remove_entry(&state.join(keep))?;
        }
        remove_leftovers(state, &[])
    }

    /// Removes a file, link or folder without following links (a link is removed, not its target).
    fn remove_entry(path: &Path) -> Result<()> {
        let meta = match fs::symlink_metadata(path) {
            Err(error) if error.kind() == ErrorKind::NotFound => return Ok(()),
            other => other.with_context(|| format!("cannot read {}", path.display()))?,
        };
        let removed = if meta.file_type().is_dir() {
            fs::remove_dir_all(path)
        } else {
            fs::remove_file(path)
        };
        removed.with_context(|| format!("cannot remove {}", path.display()))
    }

    /// Writes and syncs the set's files side by side, each in its own thread, and syncs the
    /// generation's folder beside them once every file is in it: the waits for the disk overlap instead
    /// of adding up (they were most of the demo run's writing time). All are done before the set is
    /// swapped in.
    fn write_generation(generation_path: &Path, files: &[(&str, Vec<u8>)]) -> Result<()> {
        let created = files
            .iter()
            .map(|(name, bytes)| {
                let path = generation_path.join(name);
                create_new_file(&path).map(|file| (path, file, bytes))
            })
            .collect::<Result<Vec<_>>>()?;
        std::thread::scope(|scope| {
            let writers: Vec<_> = created
                .into_iter()
                .map(|(path, file, bytes)| scope.spawn(move || fill_and_sync(file, &path, bytes)))
                .collect();
            let folder_synced = sync_dir(generation_path);
            writers.into_iter().try_for_each(|writer| {
                writer
                    .join()
                    .unwrap_or_else(|_| bail!("a thread writing an output file stopped"))
            })?;
            folder_synced
        })
    }

    /// Puts deckhold's link at a visible name (replacing an earlier output file in one rename); false
    /// when the link was already there.
    fn make_visible_link(
        folder: &Path,
        set_state: &Path,
        set: OutputSet,
        name: &str,
    ) -> Result<bool> {
        let path = folder.join(name);
        if fs::read_link(&path).is_ok_and(|target| target == visible_target(set, name)) {
            return Ok(false);
        }
        // The link's text is relative to the output folder; it is made in the set's folder (where a run
        // killed here leaves it for the next run to remove) and renamed to its name in one step.
        let staged = set_state.join(format!("link-{}", unique_suffix()));
        symlink(visible_target(set, name), &staged)
            .with_context(|| format!("cannot create {}", staged.display()))?;
        fs::rename(&staged, &path).with_context(|| format!("cannot create {}", path.display()))?;
        Ok(true)
    }

    fn sync_dir(path: &Path) -> Result<()> {
        fs::File::open(path)
            .and_then(|dir| dir.sync_all())
            .with_context(|| format!("cannot sync {}", path.display()))
    }
}

#[cfg(not(unix))]
mod platform {
    //! Fallback where symbolic links and locks are not available in the same way: each file is written to a
    //! unique temporary and renamed into place. Each file is whole, but a kill between renames can leave
    //! files of two runs side by side (documented in docs/output-sets.md).
    use super::{unique_suffix, write_new_file, OutputSet};
    use anyhow::{Context, Result};
    use std::fs;
    use std::path::{Path, PathBuf};

    pub fn write_set(
        folder: &Path,
        _set: OutputSet,
        files: &[(&str, Vec<u8>)],
    ) -> Result<Vec<PathBuf>> {
        let mut staged = Vec::new();
        for (name, bytes) in files {
            let temporary = folder.join(format!(".{name}.{}.partial", unique_suffix()));
            if let Err(error) = write_new_file(&temporary, bytes) {
                for (path, _) in &staged {
                    let _ = fs::remove_file(path);
                }
                return Err(error);
            }
            staged.push((temporary, folder.join(name)));
        }
        let mut written = Vec::new();
        for (temporary, path) in staged {
            fs::rename(&temporary, &path)
                .with_context(|| format!("cannot move the result into {}", path.display()))?;
            written.push(path);
        }
        Ok(written)
    }
}

#[cfg(test)]
mod tests {
    use super::OutputSet;

    #[test]
    fn no_name_belongs_to_two_sets() {
        let mut names: Vec<&str> = OutputSet::ALL
            .iter()
            .flat_map(|set| set.names().iter().copied())
            .collect();
        let count = names.len();
        names.sort_unstable();
        names.dedup();
        assert_eq!(names.len(), count, "{names:?}");
        let mut keys: Vec<&str> = OutputSet::ALL.iter().map(|set| set.key()).collect();
        keys.sort_unstable();
        keys.dedup();
        assert_eq!(keys.len(), OutputSet::ALL.len());
    }
}
