//! Suggest catalog ids close to a mistyped one, so an error can say what was probably meant.

/// How many suggestions an error lists.
const MAX_SUGGESTIONS: usize = 5;

/// The ids nearest to `wanted`, best first: ids that contain it or that it contains, then by edit
/// distance. Ids too far away to be a typo are left out.
pub fn close_ids<'a>(wanted: &str, ids: impl Iterator<Item = &'a str>) -> Vec<String> {
    let wanted = wanted.trim().to_ascii_lowercase();
    let mut ranked: Vec<(usize, &str)> = ids
        .map(|id| {
            let lower = id.to_ascii_lowercase();
            let contains =
                !wanted.is_empty() && (lower.contains(&wanted) || wanted.contains(&lower));
            let distance = edit_distance(&wanted, &lower);
            (if contains { 0 } else { distance }, id)
        })
        .filter(|(score, id)| *score <= typo_budget(id.len()))
        .collect();
    ranked.sort_by(|a, b| a.0.cmp(&b.0).then(a.1.cmp(b.1)));
    ranked
        .into_iter()
        .take(MAX_SUGGESTIONS)
        .map(|(_, id)| id.to_string())
        .collect()
}

/// Edits allowed before an id stops looking like the one meant: about half its length.
fn typo_budget(id_len: usize) -> usize {
    (id_len / 2).max(3)
}

/// Levenshtein distance over characters.
fn edit_distance(a: &str, b: &str) -> usize {
    let a: Vec<char> = a.chars().collect();
    let b: Vec<char> = b.chars().collect();
    let mut previous: Vec<usize> = (0..=b.len()).collect();
    for (i, ca) in a.iter().enumerate() {
        let mut current = vec![i + 1; b.len() + 1];
        for (j, cb) in b.iter().enumerate() {
            let substitution = previous[j] + usize::from(ca != cb);
            current[j + 1] = substitution.min(previous[j + 1] + 1).min(current[j] + 1);
        }
        previous = current;
    }
    previous[b.len()]
}

#[cfg(test)]
mod tests {
    use super::*;

    const IDS: [&str; 5] = ["8d-common", "6d-common", "10d-common", "8d-box", "rsrs-01"];

    #[test]
    fn a_typo_suggests_the_intended_id_first() {
        let close = close_ids("8d-comon", IDS.iter().copied());
        assert_eq!(close.first().map(String::as_str), Some("8d-common"));
    }

    #[test]
    fn a_fragment_suggests_ids_containing_it() {
        let close = close_ids("rsrs", IDS.iter().copied());
        assert_eq!(close, vec!["rsrs-01".to_string()]);
    }

    #[test]
    fn nonsense_suggests_nothing() {
        assert!(close_ids("zzzzzzzzzzzzzzzzzzzz", IDS.iter().copied()).is_empty());
    }

    #[test]
    fn edit_distance_counts_single_edits() {
        assert_eq!(edit_distance("kitten", "sitting"), 3);
        assert_eq!(edit_distance("", "abc"), 3);
        assert_eq!(edit_distance("same", "same"), 0);
    }
}
