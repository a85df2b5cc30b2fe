//! Every write to the terminal is checked. `println!` panics when standard output is closed or full
//! (`deckhold zones | head -1`, `deckhold zones > /dev/full`); the `out!`, `outln!` and `errln!` macros
//! return the error instead, and `main` ends the run: quietly for a closed pipe (as command-line tools
//! do), with a message and a non-zero exit status otherwise.

use std::fmt;
use std::io::{self, Write};

/// What reaches the terminal: the tool's own text has no control character but the line break, so any
/// other one came from user text (a name with a terminal escape) and is written escaped (`\u{1b}`).
fn terminal_text(args: fmt::Arguments) -> String {
    let text = args.to_string();
    if !text.chars().any(|c| c.is_control() && c != '\n') {
        return text;
    }
    text.split('\n')
        .map(|line| deckhold_schedule::format::escape_controls(line).into_owned())
        .collect::<Vec<_>>()
        .join("\n")
}

/// Writes to standard output and returns the error (with what was being written to).
pub fn write_out(args: fmt::Arguments) -> anyhow::Result<()> {
    io::stdout()
        .lock()
        .write_all(terminal_text(args).as_bytes())
        .map_err(|error| anyhow::Error::new(error).context("cannot write to standard output"))
}

/// Writes to standard error; a failure ends the run like a failure on standard output.
pub fn write_err(args: fmt::Arguments) -> anyhow::Result<()> {
    io::stderr()
        .lock()
        .write_all(terminal_text(args).as_bytes())
        .map_err(|error| anyhow::Error::new(error).context("cannot write to standard error"))
}

/// Flushes standard output at the end of a run, so a full disk is reported, not lost.
pub fn flush_out() -> anyhow::Result<()> {
    io::stdout()
        .flush()
        .map_err(|error| anyhow::Error::new(error).context("cannot write to standard output"))
}

/// True when the error is a closed pipe on the way out (the reader went away: not worth a message).
pub fn is_broken_pipe(error: &anyhow::Error) -> bool {
    error.chain().any(|cause| {
        cause
            .downcast_ref::<io::Error>()
            .is_some_and(|io_error| io_error.kind() == io::ErrorKind::BrokenPipe)
    })
}

/// `print!` that returns a write error to the caller with `?`.
macro_rules! out {
    ($($arg:tt)*) => {
        $crate::console::write_out(format_args!($($arg)*))?
    };
}

/// `println!` that returns a write error to the caller with `?`.
macro_rules! outln {
    () => {
        $crate::console::write_out(format_args!("\n"))?
    };
    ($($arg:tt)*) => {
        $crate::console::write_out(format_args!("{}\n", format_args!($($arg)*)))?
    };
}

/// `eprintln!` that returns a write error to the caller with `?`.
macro_rules! errln {
    ($($arg:tt)*) => {
        $crate::console::write_err(format_args!("{}\n", format_args!($($arg)*)))?
    };
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn control_characters_reach_the_terminal_escaped_and_lines_stay_lines() {
        let name = "shed\u{1b}]0;owned\u{7}";
        assert_eq!(
            terminal_text(format_args!("Project: {name}\nnext\n")),
            "Project: shed\\u{1b}]0;owned\\u{7}\nnext\n"
        );
        assert_eq!(terminal_text(format_args!("plain\n")), "plain\n");
    }
}
