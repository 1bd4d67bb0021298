package main

import (
	"bufio"
	"context"
	"encoding/json"
	"flag"
	"fmt"
	"io"
	"math"
	"os"
	"strings"

	"walden/analyze"
	"walden/grammar/source"
)

func init() {
	commands["predict"] = command{"predict the outcome of one step line", runPredict}
}

// predictJSON is one object of `walden predict --json`. The fields
// mechanism, products, diagnostics and stereo are a stable interface
// (DESIGN.md, "Interfaces that outside checks rely on").
type predictJSON struct {
	Input       string           `json:"input"`
	Mechanism   string           `json:"mechanism"`
	Products    []predictProduct `json:"products"`
	Diagnostics []predictDiag    `json:"diagnostics"`
	Stereo      []predictStereo  `json:"stereo"`
	Reasons     []string         `json:"reasons"`
	NotAnalysed string           `json:"not_analysed,omitempty"`
	Through     []string         `json:"through,omitempty"`
}

type predictProduct struct {
	SMILES   string  `json:"smiles"`
	Fraction float64 `json:"fraction"`
	Role     string  `json:"role"` // "major" or "minor"
}

type predictDiag struct {
	Code     string    `json:"code"`
	Severity string    `json:"severity"`
	Message  string    `json:"message"`
	Range    jsonRange `json:"range"`
}

// predictStereo is one stereocentre at the substrate's reacting carbon.
type predictStereo struct {
	Atom          int    `json:"atom"` // 1-based, SMILES input order (as walden stereo numbers atoms)
	Before        string `json:"before"`
	After         string `json:"after"`
	Outcome       string `json:"outcome"` // inverted, retained or lost
	LetterChanged bool   `json:"letter_changed"`
}

func runPredict(args []string, stdin io.Reader, stdout, stderr io.Writer) int {
	fl := flag.NewFlagSet("predict", flag.ContinueOnError)
	fl.SetOutput(stderr)
	asJSON := fl.Bool("json", false, "print one JSON object per step")
	file := fl.String("file", "", "read one step per line from this file ('-' for standard input)")
	fl.Usage = func() {
		fmt.Fprintln(stderr, "usage: walden predict [--json] 'STEP LINE'")
		fmt.Fprintln(stderr, "       walden predict [--json] --file FILE")
		fmt.Fprintln(stderr, "\nexample: walden predict 'C[C@H](Br)CCc1ccccc1 + NaN3, DMF, 60 °C'")
		fl.PrintDefaults()
	}
	if err := fl.Parse(args); err != nil {
		return exitUsage
	}
	var text []byte
	switch {
	case *file != "" && fl.NArg() == 0:
		var err error
		if *file == "-" {
			text, err = io.ReadAll(io.LimitReader(stdin, maxFileSize))
		} else {
			text, err = os.ReadFile(*file)
		}
		if err != nil {
			fmt.Fprintln(stderr, "walden predict:", err)
			return exitUsage
		}
	case *file == "" && fl.NArg() > 0:
		text = []byte(strings.Join(fl.Args(), " "))
		if strings.TrimSpace(string(text)) == "" {
			fmt.Fprintln(stderr, "walden predict: the step line is empty")
			return exitUsage
		}
		if strings.ContainsAny(string(text), "\r\n") {
			fmt.Fprintln(stderr, "walden predict: give one line; use --file for several")
			return exitUsage
		}
	default:
		fl.Usage()
		return exitUsage
	}
	cfg, _, _ := analyze.LoadSettings(".", os.ReadFile)
	eng := analyze.NewEngine(cfg)
	reps, _ := eng.Analyze(context.Background(), []analyze.Source{{Name: "predict", Kind: analyze.PlanFile, Text: text}})
	rep := reps[0]
	m := source.NewMapper(text)
	w := bufio.NewWriter(stdout)
	defer w.Flush()
	worst := analyze.Severity(0)
	for _, st := range rep.Steps {
		var diags []analyze.Diagnostic
		for _, d := range rep.Diagnostics {
			if d.Span.Start >= st.Span.Start && d.Span.Start <= st.Span.End {
				diags = append(diags, d)
				if worst == 0 || d.Severity < worst {
					worst = d.Severity
				}
			}
		}
		line := string(text[st.Span.Start:st.Span.End])
		if *asJSON {
			b, _ := json.Marshal(predictObject(line, st, diags, m))
			w.Write(b)
			w.WriteByte('\n')
		} else {
			writePrediction(w, line, st, diags, m, *file != "")
		}
	}
	if worst == analyze.Error {
		return exitFindings
	}
	return exitClean
}

func predictObject(line string, st analyze.StepReport, diags []analyze.Diagnostic, m *source.Mapper) predictJSON {
	o := predictJSON{Input: line, Mechanism: "none", Products: []predictProduct{}, Diagnostics: []predictDiag{}, Stereo: []predictStereo{}, Reasons: []string{}}
	if p := st.Prediction; p != nil {
		o.Mechanism, o.NotAnalysed, o.Through = p.Mechanism, p.NotAnalysed, p.Through
		if p.Reasons != nil {
			o.Reasons = p.Reasons
		}
		for _, x := range p.Products {
			role := "minor"
			if x.Major {
				role = "major"
			}
			// Four decimals: the shares come from rounded scores, and
			// 0.9999999972 would only suggest a precision they lack.
			o.Products = append(o.Products, predictProduct{x.SMILES, math.Round(x.Fraction*1e4) / 1e4, role})
		}
		for _, c := range p.Stereo {
			o.Stereo = append(o.Stereo, predictStereo{c.Atom + 1, c.Before, c.After, c.Outcome, c.LetterChanged})
		}
	}
	for _, d := range diags {
		l, c, el, ec := m.Range(d.Span)
		o.Diagnostics = append(o.Diagnostics, predictDiag{d.Code, d.Severity.String(), d.Message, jsonRange{jsonPosition{l, c}, jsonPosition{el, ec}}})
	}
	return o
}

// writePrediction prints a step's prediction for people.
func writePrediction(w io.Writer, line string, st analyze.StepReport, diags []analyze.Diagnostic, m *source.Mapper, many bool) {
	if many {
		fmt.Fprintf(w, "%d: %s\n", m.Point(st.Span.Start).Line, line)
	} else {
		fmt.Fprintln(w, line)
	}
	if p := st.Prediction; p != nil {
		if p.NotAnalysed != "" {
			fmt.Fprintf(w, "  not analysed: %s\n", p.NotAnalysed)
		}
		for _, x := range p.Products {
			role := "minor"
			if x.Major {
				role = "major"
			}
			mech := x.Mechanism
			if mech == "" || mech == "none" {
				mech = "–" // no bond to the carbon made or broken (e.g. O-sulfonylation)
			}
			fmt.Fprintf(w, "  %-5s %-4s %4.0f%%  %s\n", role, mech, 100*x.Fraction, x.SMILES)
		}
		if len(p.Products) == 0 && p.NotAnalysed == "" {
			fmt.Fprintf(w, "  %s: no product\n", p.Mechanism)
		}
		for _, c := range p.Stereo {
			fmt.Fprintf(w, "  atom %d: %s\n", c.Atom+1, c.Describe())
		}
		if len(p.Through) > 1 {
			fmt.Fprintf(w, "  through the plan: %s\n", strings.Join(p.Through, " → "))
		}
		for _, r := range p.Reasons {
			fmt.Fprintf(w, "  - %s\n", r)
		}
	}
	for _, d := range diags {
		fmt.Fprintf(w, "  %s: %s %s: %s\n", m.Point(d.Span.Start), d.Severity, d.Code, d.Message)
	}
}

func dash(s string) string {
	if s == "" {
		return "–"
	}
	return s
}
