//! Output sets are all or nothing (docs/output-sets.md): concurrent runs each leave a whole set, a run killed
//! at any instant leaves the previous or the new set, never a mix, and nothing the tool did not write is
//! touched or followed. Unix only: elsewhere the fallback writes file by file.
#![cfg(unix)]

use std::fs;
use std::path::{Path, PathBuf};
use std::process::{Command, Stdio};
use std::time::{Duration, Instant};

mod support;
use support::fixture;

const SET: [&str; 3] = ["schedule.csv", "rafter-lines.csv", "schedule.pdf"];

fn binary() -> PathBuf {
    PathBuf::from(env!("CARGO_BIN_EXE_deckhold"))
}

fn run_into(project: Option<&Path>, out: &Path) -> Command {
    let mut command = Command::new(binary());
    command.arg("run");
    if let Some(project) = project {
        command.arg(project);
    }
    command
        .arg("--out")
        .arg(out)
        .stdout(Stdio::null())
        .stderr(Stdio::null());
    command
}

/// The visible set's bytes, or None for a name that is absent.
fn read_set(out: &Path) -> Vec<Option<Vec<u8>>> {
    SET.iter()
        .map(|name| fs::read(out.join(name)).ok())
        .collect()
}

fn reference_set(project: Option<&Path>, folder: &Path) -> Vec<Option<Vec<u8>>> {
    let status = run_into(project, folder).status().expect("runs");
    assert!(status.success(), "the reference run works");
    let set = read_set(folder);
    assert!(
        set.iter().all(Option::is_some),
        "the reference set is whole"
    );
    set
}

/// Names in the schedule set's state folder that are neither the current link nor the current generation.
fn leftovers(out: &Path) -> Vec<String> {
    let state = out.join(".deckhold").join("schedule");
    let current = fs::read_link(state.join("current")).ok();
    fs::read_dir(&state)
        .map(|entries| {
            entries
                .filter_map(Result::ok)
                .map(|entry| entry.file_name().to_string_lossy().to_string())
                .filter(|name| name != "current" && Some(Path::new(name)) != current.as_deref())
                .collect()
        })
        .unwrap_or_default()
}

/// The generation the schedule set's `current` names, if any.
fn in_force(out: &Path) -> Option<String> {
    fs::read_link(out.join(".deckhold").join("schedule").join("current"))
        .ok()
        .map(|target| target.to_string_lossy().to_string())
}

/// What a completed run left besides the set in force, other than `replaced`: the generation that was
/// in force before it, which stays until the next run removes it (docs/output-sets.md, step 6).
fn leftovers_besides(out: &Path, replaced: Option<String>) -> Vec<String> {
    leftovers(out)
        .into_iter()
        .filter(|name| Some(name) != replaced.as_ref())
        .collect()
}

#[test]
fn eight_concurrent_runs_leave_one_whole_set_identical_to_a_single_run() {
    let folder = tempfile::tempdir().expect("temp dir");
    let single = reference_set(None, &folder.path().join("single"));
    let out = folder.path().join("shared");
    fs::create_dir(&out).expect("folder");
    fs::write(out.join("notes.txt"), b"the owner's notes").expect("notes");
    let children: Vec<_> = (0..8)
        .map(|_| run_into(None, &out).spawn().expect("spawns"))
        .collect();
    for mut child in children {
        assert!(child.wait().expect("waits").success(), "every run works");
    }
    assert_eq!(read_set(&out), single, "one whole set, byte-identical");
    assert_eq!(
        fs::read(out.join("notes.txt")).expect("notes"),
        b"the owner's notes"
    );
    // The last run leaves the generation it replaced (the next run removes it), and nothing else.
    let left = leftovers(&out);
    assert!(
        left.len() <= 1 && left.iter().all(|name| name.starts_with("gen-")),
        "left: {left:?}"
    );
}

/// A small deterministic generator (xorshift), so a failure can be replayed from its seed.
fn next(state: &mut u64) -> u64 {
    *state ^= *state << 13;
    *state ^= *state >> 7;
    *state ^= *state << 17;
    *state
}

#[test]
fn runs_killed_at_random_instants_never_leave_a_mixed_set() {
    let folder = tempfile::tempdir().expect("temp dir");
    let us = fixture("us-hip.json");
    let set_a = reference_set(None, &folder.path().join("a"));
    let set_b = reference_set(Some(&us), &folder.path().join("b"));
    assert_ne!(set_a, set_b, "the two projects give different sets");
    let out = folder.path().join("killed");
    // How long a whole run takes here, to spread the kills over it.
    let started = Instant::now();
    reference_set(None, &folder.path().join("timing"));
    let run_us = started.elapsed().as_micros().max(1000) as u64;

    let mut seed = 0x9e37_79b9_7f4a_7c15_u64;
    let (mut killed, mut mixed, mut whole) = (0, 0, 0);
    let rounds = 40;
    for round in 0..rounds {
        let project = (round % 2 == 1).then_some(us.as_path());
        let mut child = run_into(project, &out).spawn().expect("spawns");
        let delay_us = next(&mut seed) % (run_us + run_us / 4);
        std::thread::sleep(Duration::from_micros(delay_us));
        if child.try_wait().expect("polls").is_none() {
            child.kill().expect("kills");
            killed += 1;
        }
        let _ = child.wait();
        let set = read_set(&out);
        let nothing_yet = set.iter().all(Option::is_none);
        if set == set_a || set == set_b || nothing_yet {
            whole += 1;
        } else {
            mixed += 1;
        }
    }
    // One more run that completes: it removes what the killed runs left behind.
    let replaced = in_force(&out);
    assert!(run_into(None, &out).status().expect("runs").success());
    assert_eq!(read_set(&out), set_a);
    let left = leftovers_besides(&out, replaced);
    assert!(left.is_empty(), "left: {left:?}");
    eprintln!(
        "output sets: {rounds} runs, {killed} killed part-way, {whole} whole sets, {mixed} mixed"
    );
    assert_eq!(mixed, 0, "a killed run left a mixed set");
    assert!(killed > 0, "some runs were killed part-way");
}

#[test]
fn a_name_taken_by_a_folder_or_a_foreign_link_is_refused_and_left_alone() {
    let folder = tempfile::tempdir().expect("temp dir");
    let out = folder.path().join("taken");
    fs::create_dir_all(out.join("schedule.pdf")).expect("a folder named like the PDF");
    let output = run_into(None, &out)
        .stderr(Stdio::piped())
        .output()
        .expect("runs");
    assert_eq!(output.status.code(), Some(2));
    let message = String::from_utf8_lossy(&output.stderr);
    assert!(
        message.contains("schedule.pdf is taken by something that is not a file"),
        "{message}"
    );
    assert!(out.join("schedule.pdf").is_dir());
    assert!(!out.join("schedule.csv").exists(), "nothing half-written");

    let out = folder.path().join("linked");
    fs::create_dir(&out).expect("folder");
    let target = folder.path().join("elsewhere.csv");
    fs::write(&target, b"not ours").expect("target");
    std::os::unix::fs::symlink(&target, out.join("schedule.csv")).expect("planted link");
    let output = run_into(None, &out)
        .stderr(Stdio::piped())
        .output()
        .expect("runs");
    assert_eq!(output.status.code(), Some(2));
    assert!(String::from_utf8_lossy(&output.stderr).contains("a link deckhold did not make"));
    assert_eq!(
        fs::read(&target).expect("target"),
        b"not ours",
        "never followed"
    );
}

#[test]
fn an_earlier_plain_file_is_replaced_and_a_planted_state_link_is_refused() {
    let folder = tempfile::tempdir().expect("temp dir");
    let out = folder.path().join("earlier");
    fs::create_dir(&out).expect("folder");
    fs::write(out.join("schedule.csv"), b"an earlier schedule").expect("earlier file");
    assert!(run_into(None, &out).status().expect("runs").success());
    let single = reference_set(None, &folder.path().join("single"));
    assert_eq!(read_set(&out), single);

    let out = folder.path().join("planted");
    fs::create_dir(&out).expect("folder");
    let elsewhere = folder.path().join("elsewhere");
    fs::create_dir(&elsewhere).expect("elsewhere");
    std::os::unix::fs::symlink(&elsewhere, out.join(".deckhold")).expect("planted link");
    assert_eq!(run_into(None, &out).status().expect("runs").code(), Some(2));
    assert_eq!(
        fs::read_dir(&elsewhere).expect("lists").count(),
        0,
        "nothing written through it"
    );
}

const CHECK_SET: [&str; 2] = ["check.csv", "check.pdf"];

/// `check --out` of the retrofit fixture into `out`.
fn check_into(out: &Path) -> Command {
    let mut command = Command::new(binary());
    command
        .arg("check")
        .arg(fixture("us-retrofit-1970s.json"))
        .arg("--add")
        .arg("rsrs-01")
        .arg("--out")
        .arg(out)
        .stdout(Stdio::null())
        .stderr(Stdio::null());
    command
}

fn read_names(out: &Path, names: &[&str]) -> Vec<Option<Vec<u8>>> {
    names
        .iter()
        .map(|name| fs::read(out.join(name)).ok())
        .collect()
}

#[test]
fn a_check_report_written_after_a_schedule_leaves_the_schedule_alone() {
    let folder = tempfile::tempdir().expect("temp dir");
    let out = folder.path().join("job");
    let schedule = reference_set(None, &out);
    assert!(check_into(&out).status().expect("runs").success());
    assert_eq!(read_set(&out), schedule, "the schedule set is untouched");
    let report = read_names(&out, &CHECK_SET);
    assert!(report.iter().all(Option::is_some), "the check set is whole");
    // And again: a second check replaces only its own set.
    assert!(check_into(&out).status().expect("runs").success());
    assert_eq!(read_set(&out), schedule);
    assert_eq!(read_names(&out, &CHECK_SET), report);
}

#[test]
fn a_schedule_written_after_a_check_report_leaves_the_report_alone() {
    let folder = tempfile::tempdir().expect("temp dir");
    let out = folder.path().join("job");
    assert!(check_into(&out).status().expect("runs").success());
    let report = read_names(&out, &CHECK_SET);
    assert!(report.iter().all(Option::is_some), "the check set is whole");
    assert_eq!(in_force(&out), None, "no schedule yet");
    let schedule = reference_set(None, &out);
    assert_eq!(
        read_names(&out, &CHECK_SET),
        report,
        "the check set is untouched"
    );
    assert_eq!(read_set(&out), schedule);
    assert!(leftovers(&out).is_empty(), "left: {:?}", leftovers(&out));
}

/// A folder an earlier deckhold wrote (one shared `.deckhold/current` for every command): a check keeps
/// the schedule's old links working; once every set is rewritten, the old state goes.
#[test]
fn a_folder_of_the_earlier_shared_layout_is_taken_over_set_by_set() {
    let folder = tempfile::tempdir().expect("temp dir");
    let out = folder.path().join("earlier");
    let names: Vec<&str> = SET.iter().chain(&CHECK_SET).copied().collect();
    earlier_folder(&out, false, &names);
    let generation = out.join(".deckhold").join("gen-1-2-3");

    assert!(check_into(&out).status().expect("runs").success());
    assert_eq!(
        fs::read(out.join("schedule.csv")).expect("still readable"),
        b"earlier schedule.csv",
        "the earlier schedule is left as it was"
    );
    assert_ne!(
        fs::read(out.join("check.csv")).expect("new report"),
        b"earlier check.csv"
    );
    assert!(
        out.join(".deckhold").join("current").exists(),
        "still in use"
    );

    let schedule = reference_set(None, &out);
    assert_eq!(read_set(&out), schedule);
    assert!(
        fs::symlink_metadata(out.join(".deckhold").join("current")).is_err(),
        "the earlier shared state is removed once nothing links through it"
    );
    assert!(!generation.exists());
    assert!(read_names(&out, &CHECK_SET).iter().all(Option::is_some));
}

#[test]
fn a_comparison_written_beside_a_schedule_and_a_report_leaves_both_alone() {
    let folder = tempfile::tempdir().expect("temp dir");
    let out = folder.path().join("job");
    let schedule = reference_set(None, &out);
    assert!(check_into(&out).status().expect("runs").success());
    let report = read_names(&out, &CHECK_SET);
    let compare = |out: &Path| {
        Command::new(binary())
            .arg("compare")
            .arg("--out")
            .arg(out)
            .stdout(Stdio::null())
            .stderr(Stdio::null())
            .status()
            .expect("runs")
    };
    assert!(compare(&out).success());
    let comparison = read_names(&out, &["compare.csv", "compare.pdf"]);
    assert!(
        comparison.iter().all(Option::is_some),
        "the compare set is whole"
    );
    assert_eq!(read_set(&out), schedule, "the schedule set is untouched");
    assert_eq!(
        read_names(&out, &CHECK_SET),
        report,
        "the check set is untouched"
    );
    // A run after the comparison leaves the comparison as it was.
    assert!(run_into(None, &out).status().expect("runs").success());
    assert_eq!(
        read_names(&out, &["compare.csv", "compare.pdf"]),
        comparison
    );
}

/// Lays out a folder as an earlier deckhold left it: `plain` writes the set as plain files (before the
/// set layout), otherwise as links of the shared layout (one `.deckhold/current` for every command).
fn earlier_folder(out: &Path, plain: bool, names: &[&str]) {
    use std::os::unix::fs::symlink;
    if plain {
        fs::create_dir_all(out).expect("folder");
        for name in names {
            fs::write(out.join(name), format!("earlier {name}")).expect("file");
        }
        return;
    }
    let generation = out.join(".deckhold").join("gen-1-2-3");
    fs::create_dir_all(&generation).expect("generation");
    for name in names {
        fs::write(generation.join(name), format!("earlier {name}")).expect("file");
        symlink(
            Path::new(".deckhold").join("current").join(name),
            out.join(name),
        )
        .expect("link");
    }
    symlink("gen-1-2-3", out.join(".deckhold").join("current")).expect("current");
}

#[test]
fn a_first_run_stopped_after_any_step_shows_nothing_or_its_whole_set() {
    // Into a fresh folder: a run stopped after step 1, 2, ... (an abort, as a kill there would) shows
    // no name at all or the whole set, never some names without the others.
    let folder = tempfile::tempdir().expect("temp dir");
    let new_set = reference_set(None, &folder.path().join("reference"));
    let nothing: Vec<Option<Vec<u8>>> = vec![None; SET.len()];
    let mut stops = 0;
    for step in 1..=64 {
        let out = folder.path().join(format!("fresh-{step}"));
        let status = run_into(None, &out)
            .env("DECKHOLD_FAULT_AFTER", step.to_string())
            .status()
            .expect("runs");
        let set = read_set(&out);
        assert!(
            set == nothing || set == new_set,
            "stopped after step {step}: some of the set's names show without the others"
        );
        if status.success() {
            assert_eq!(set, new_set, "a run through every step shows the new set");
            break;
        }
        stops += 1;
    }
    assert!(stops >= 4, "only {stops} steps to stop at");
}

#[test]
fn taking_over_an_earlier_folder_stopped_at_every_step_never_shows_a_mix() {
    let folder = tempfile::tempdir().expect("temp dir");
    let new_set = reference_set(None, &folder.path().join("reference"));
    let earlier_set: Vec<Option<Vec<u8>>> = SET
        .iter()
        .map(|name| Some(format!("earlier {name}").into_bytes()))
        .collect();
    let mut report = Vec::new();
    for plain in [true, false] {
        let (mut stopped, mut mixed, mut steps) = (0, 0, 0);
        // Stop the run after step 1, 2, ... of writing the set (an abort, as a kill there would), until
        // a run gets through every step; each stop starts again from the earlier folder.
        for step in 1..=64 {
            let out = folder.path().join(format!("earlier-{plain}-{step}"));
            earlier_folder(&out, plain, &SET);
            let status = run_into(None, &out)
                .env("DECKHOLD_FAULT_AFTER", step.to_string())
                .status()
                .expect("runs");
            let set = read_set(&out);
            if set != earlier_set && set != new_set {
                mixed += 1;
                eprintln!("stopped after step {step} (plain {plain}): a mix");
            }
            if status.success() {
                steps = step - 1;
                assert_eq!(set, new_set, "a run through every step shows the new set");
                break;
            }
            stopped += 1;
            if step % 3 != 0 {
                continue;
            }
            // The next run completes and cleans up after the stopped one (every third stop, for time).
            // It leaves only the generation it replaced: the earlier files it adopted, when the stopped
            // run had not made them current yet, or the one that was current; a further run removes it.
            assert!(run_into(None, &out).status().expect("runs").success());
            assert_eq!(read_set(&out), new_set);
            let left = leftovers(&out);
            assert!(
                left.len() <= 1 && left.iter().all(|name| name.starts_with("gen-")),
                "left: {left:?}"
            );
            let replaced = in_force(&out);
            assert!(run_into(None, &out).status().expect("runs").success());
            let left = leftovers_besides(&out, replaced);
            assert!(left.is_empty(), "left: {left:?}");
        }
        assert!(steps > 4, "the write has steps to stop at ({steps})");
        assert_eq!(stopped, steps, "every step was stopped at once");
        assert_eq!(mixed, 0, "a take-over stopped part-way showed a mix");
        report.push(format!(
            "{}: {stopped} runs stopped, {mixed} mixed",
            if plain {
                "plain files"
            } else {
                "shared layout"
            }
        ));
    }
    eprintln!("earlier-folder take-over: {}", report.join("; "));
}
