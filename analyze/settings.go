package analyze

import (
	"bytes"
	"path/filepath"
	"strconv"
	"strings"

	"walden/grammar/source"
)

// SettingsFile is the name of the project settings file. walden looks for
// it in the folder of the file being checked and then in each parent
// folder, and uses the first one found, so one file at a notebook folder's
// root covers every page below it.
//
// The format is one setting per line, "key = value"; blank lines and
// everything after a '#' are ignored:
//
//	# Kestrel process lab
//	names       = lab-names.txt            # the lab's own names file, relative to this file
//	disable     = caution-lachrymator, no-solvent
//	solvent     = DMF                      # assumed when a step names none
//	temperature = 25 °C                    # assumed when a step gives none
const SettingsFile = "walden.settings"

// settingKeys lists the keys a settings file may use, with what they set.
var settingKeys = map[string]string{
	"names":       "the lab's own names file, relative to the settings file",
	"disable":     "diagnostic codes not to report, comma-separated",
	"solvent":     "the solvent assumed when a step names none",
	"temperature": "the temperature assumed when a step gives none (e.g. 25 °C)",
}

// ParseSettings reads the text of a settings file. The returned Config
// holds everything that could be read; errors are positioned in text. The
// names file is not read here: Config.LabNamesFile holds its path, joined
// to dir (the settings file's folder), for the caller to read.
func ParseSettings(dir string, text []byte) (Config, source.ErrorList) {
	var cfg Config
	var errs source.ErrorList
	seen := map[string]bool{}
	off := 0
	for len(text) > 0 {
		line := text
		next := len(text)
		if i := bytes.IndexByte(text, '\n'); i >= 0 {
			line, next = text[:i], i+1
		}
		parseSetting(&cfg, &errs, seen, dir, string(line), source.Pos(off))
		text = text[next:]
		off += next
	}
	errs.Sort()
	return cfg, errs
}

func parseSetting(cfg *Config, errs *source.ErrorList, seen map[string]bool, dir, line string, at source.Pos) {
	if i := strings.IndexByte(line, '#'); i >= 0 {
		line = line[:i]
	}
	line = strings.TrimRight(line, " \t\r")
	lead := len(line) - len(strings.TrimLeft(line, " \t"))
	if lead == len(line) {
		return
	}
	whole := source.Span{Start: at + source.Pos(lead), End: at + source.Pos(len(line))}
	eq := strings.IndexAny(line, "=:")
	if eq < 0 {
		errs.Add(whole, "settings", "expected 'key = value', found no '='")
		return
	}
	key := strings.TrimSpace(line[:eq])
	keySpan := source.Span{Start: whole.Start, End: whole.Start + source.Pos(len(key))}
	raw := line[eq+1:]
	vlead := len(raw) - len(strings.TrimLeft(raw, " \t"))
	val := strings.TrimSpace(raw)
	valSpan := source.Span{Start: at + source.Pos(eq+1+vlead), End: whole.End}
	low := strings.ToLower(key)
	if _, ok := settingKeys[low]; !ok {
		errs.Addf(keySpan, "settings", "unknown setting %q; expected one of %s", key, knownKeys())
		return
	}
	if seen[low] {
		errs.Addf(keySpan, "settings", "setting %q is given twice; the first one is kept", key)
		return
	}
	seen[low] = true
	if val == "" {
		errs.Addf(whole, "settings", "setting %q has no value", key)
		return
	}
	switch low {
	case "names":
		p := filepath.FromSlash(val)
		if !filepath.IsAbs(p) && dir != "" {
			p = filepath.Join(dir, p)
		}
		cfg.LabNamesFile = p
	case "disable":
		for _, c := range strings.Split(val, ",") {
			if c = strings.TrimSpace(c); c != "" {
				cfg.Disabled = append(cfg.Disabled, c)
			}
		}
	case "solvent":
		cfg.DefaultSolvent = val
	case "temperature":
		t, ok := parseCelsius(val)
		if !ok {
			errs.Addf(valSpan, "settings", "temperature %q not understood; expected degrees Celsius such as '25 °C' or 'rt'", val)
			return
		}
		cfg.DefaultTempC = &t
	}
}

func knownKeys() string {
	return "names, disable, solvent, temperature"
}

// parseCelsius reads "25", "25 C", "25 °C", "25°C" or "rt".
func parseCelsius(s string) (float64, bool) {
	s = strings.TrimSpace(s)
	if strings.EqualFold(s, "rt") || strings.EqualFold(s, "room temperature") {
		return roomTempC, true
	}
	s = strings.TrimSuffix(s, "C")
	s = strings.TrimSuffix(s, "c")
	s = strings.TrimSpace(strings.TrimSuffix(s, "°"))
	v, err := strconv.ParseFloat(s, 64)
	if err != nil || v < -273.15 || v > 2000 {
		return 0, false
	}
	return v, true
}

// roomTempC is what "rt" means: 20–25 °C by common practice; 25 °C is used.
const roomTempC = 25

// LoadSettings finds the settings file for the file or folder at start by
// walking up its folders, reads it and the names file it points to, and
// returns the Config with the settings file's path ("" when none was
// found). read is the caller's way to read a file (os.ReadFile on disk, an
// overlay in the editor); analyze itself does no IO. Errors in the names
// file are reported by the dictionary when the Engine loads it; here only
// a names file that cannot be read is reported, on the "names" line.
func LoadSettings(start string, read func(path string) ([]byte, error)) (cfg Config, file string, errs source.ErrorList) {
	// A file's own path joined with SettingsFile cannot be read, so the
	// walk starts at a file or a folder alike without asking which.
	dir := filepath.Clean(start)
	for {
		p := filepath.Join(dir, SettingsFile)
		if text, err := read(p); err == nil {
			cfg, errs = ParseSettings(dir, text)
			if cfg.LabNamesFile != "" {
				names, err := read(cfg.LabNamesFile)
				if err != nil {
					errs.Addf(namesLine(text), "settings", "cannot read the names file: %v", err)
				} else {
					cfg.LabNames = names
				}
			}
			errs.Sort()
			return cfg, p, errs
		}
		parent := filepath.Dir(dir)
		if parent == dir {
			return Config{}, "", nil
		}
		dir = parent
	}
}

// namesLine returns the span of the "names" setting's line.
func namesLine(text []byte) source.Span {
	off := 0
	for _, l := range strings.SplitAfter(string(text), "\n") {
		if k, _, ok := strings.Cut(strings.TrimSpace(l), "="); ok && strings.EqualFold(strings.TrimSpace(k), "names") {
			return source.Span{Start: source.Pos(off), End: source.Pos(off + len(strings.TrimRight(l, "\r\n")))}
		}
		off += len(l)
	}
	return source.Span{}
}
