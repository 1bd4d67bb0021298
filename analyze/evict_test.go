package analyze

import (
	"context"
	"fmt"
	"strings"
	"testing"
)

// TestCacheStaysBounded: a chemist typing into one line of a long page
// makes a new line text on every keystroke; the Engine must not keep them
// all, yet must keep the lines of a page that is open but not being
// edited, so that its next edit is not a reopening.
func TestCacheStaysBounded(t *testing.T) {
	page := string(benchNotebook(400))
	other := []Source{{Name: "other.steps", Kind: PlanFile, Text: []byte("CCBr + NaN3, DMF, 25 °C\nCC(C)Br + KOtBu, THF, 60 °C\n")}}
	e := NewEngine(Config{})
	ctx := context.Background()
	if _, err := e.Analyze(ctx, other); err != nil {
		t.Fatal(err)
	}
	at := strings.Index(page, "NaI, acetone, 23 °C")
	if at < 0 {
		t.Fatal("the bench page no longer has the line this test edits")
	}
	var opened int
	for i := range 3000 {
		text := page[:at] + fmt.Sprintf("NaI, acetone, %d °C", 1000+i) + page[at+len("NaI, acetone, 23 °C"):]
		if _, err := e.Analyze(ctx, []Source{{Name: "page.md", Kind: MarkdownPage, Text: []byte(text)}}); err != nil {
			t.Fatal(err)
		}
		if i == 0 {
			opened = e.CachedLines()
		}
	}
	if n := e.CachedLines(); n > opened+opened/4+sweepMin+keepGens {
		t.Errorf("after 3000 edits the Engine keeps %d line texts; the open pages have about %d", n, opened)
	}
	before := e.Analysed()
	if _, err := e.Analyze(ctx, other); err != nil {
		t.Fatal(err)
	}
	if n := e.Analysed() - before; n != 0 {
		t.Errorf("the page open but not edited lost its cached lines: %d steps analysed again", n)
	}
}
