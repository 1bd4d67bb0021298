package reagents

import "sort"

// Suggest returns up to n dictionary names closest to name, best first,
// for messages like "unknown reagent or solvent 'NaN4'; did you mean NaN3?"
// and for completion while the user types. Names are compared as Lookup
// compares them, case folded. A name that starts with what was typed ranks
// first (shorter names before longer); then names within a small edit
// distance — insertions, deletions, substitutions and swaps of neighbours
// (optimal string alignment) — allowing 1 edit for up to 4 characters, 2
// for up to 8 and 3 beyond. Only the best name of each entry is offered,
// so the list names different substances.
func (d *Dictionary) Suggest(name string, n int) []string {
	if n <= 0 {
		return nil
	}
	var buf [maxKey]byte
	q, _ := normalize(buf[:0], name, true)
	if len(q) == 0 {
		return nil
	}
	limit := 3
	switch {
	case len(q) <= 4:
		limit = 1
	case len(q) <= 8:
		limit = 2
	}
	type hit struct {
		score int
		rec   *nameRec
	}
	var hits []hit
	for i := range d.names {
		rec := &d.names[i]
		k := rec.key
		var score int
		switch {
		case len(k) >= len(q) && k[:len(q)] == string(q):
			score = 100 + len(k) - len(q) // a completion of what was typed
			if len(k) == len(q) {
				score = 0
			}
		case abs(len(k)-len(q)) > limit:
			continue
		default:
			dist := osa(q, k, limit)
			if dist > limit {
				continue
			}
			score = 200*dist + abs(len(k)-len(q))
		}
		hits = append(hits, hit{score, rec})
	}
	sort.Slice(hits, func(i, j int) bool {
		if hits[i].score != hits[j].score {
			return hits[i].score < hits[j].score
		}
		return hits[i].rec.text < hits[j].rec.text
	})
	out := make([]string, 0, min(n, len(hits)))
	seen := make([]ref, 0, n)
outer:
	for _, h := range hits {
		for _, r := range seen {
			if r.r == h.rec.ref.r && r.s == h.rec.ref.s {
				continue outer
			}
		}
		seen = append(seen, h.rec.ref)
		out = append(out, h.rec.text)
		if len(out) == n {
			break
		}
	}
	return out
}

func abs(x int) int {
	if x < 0 {
		return -x
	}
	return x
}

// osa returns the optimal-string-alignment distance between a and b
// (Levenshtein with transpositions of adjacent bytes), or limit+1 as soon
// as it is sure to exceed limit. Keys are at most maxKey bytes, so the
// rows live on the stack.
func osa(a []byte, b string, limit int) int {
	var rows [3][maxKey + 1]int
	prev2, prev, cur := &rows[0], &rows[1], &rows[2]
	for j := 0; j <= len(b); j++ {
		prev[j] = j
	}
	for i := 1; i <= len(a); i++ {
		cur[0] = i
		best := cur[0]
		for j := 1; j <= len(b); j++ {
			cost := 1
			if a[i-1] == b[j-1] {
				cost = 0
			}
			v := min(prev[j]+1, cur[j-1]+1, prev[j-1]+cost)
			if i > 1 && j > 1 && a[i-1] == b[j-2] && a[i-2] == b[j-1] {
				v = min(v, prev2[j-2]+1)
			}
			cur[j] = v
			best = min(best, v)
		}
		if best > limit {
			return limit + 1
		}
		prev2, prev, cur = prev, cur, prev2
	}
	return prev[len(b)]
}
