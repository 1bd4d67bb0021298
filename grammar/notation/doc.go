// Package notation reads walden's step lines: one reaction per line, as a
// chemist writes it in a notebook.
//
//	[x] azide: @mesylate + NaN3 (1.5 eq), DMF, 60 °C, 12 h -> C[C@H](N=[N+]=[N-])CCc1ccccc1 // 2026-03-02
//
// Grammar (EBNF; "␣" stands for one or more spaces, tabs or no-break
// spaces; words are separated by spaces):
//
//	step       = [ mark ␣ ] [ label ␣ ] reactants { "," term } [ arrow [ products ] { "," term } ] [ comment ] .
//	mark       = "[x]" | "[X]" | "[-]" | "[ ]" .            (done, done, skipped, open)
//	label      = name ":" | digits ( "." | ")" ) .           (first word; a SMILES never ends in ':' nor starts with a digit)
//	name       = ( letter | digit | "_" | "-" | "'" ) { letter | digit | "_" | "-" | "'" } .
//	reactants  = term { ␣ "+" ␣ term } .                    (the first term holds the substrate)
//	products   = term { ␣ "+" ␣ term } .
//	arrow      = "->" | "→" | "⟶" .
//	comment    = "//" any-text .                            (at the start or after a space)
//	term       = { quantity } [ substance ] { quantity | "(" group ")" } .
//	group      = ( quantity { quantity } | note ) { "," ( quantity { quantity } | note ) } .
//	substance  = "@" name                                   (an earlier step's product)
//	           | word                                       (SMILES, dotted SMILES, or a name)
//	           | word ␣ word { ␣ word }                     (a name of several words)
//	           | part ( "/" | "–" | "—" ) part { ... } [ ratio ] .  (a mixture)
//	quantity   = [ "at" | "for" ] ( number [␣] unit | quantity-word ) [ "to" quantity ] | ratio .
//	number     = [ "-" | "−" | "–" | "+" ] digits [ "." digits ] [ ( "-" | "–" ) digits [ "." digits ] ] .
//	ratio      = digits ":" digits { ":" digits } [ "v/v" ] .
//
// Units (units.tsv) and quantity words (words.tsv) are data: °C, ºC, ℃, C,
// degC, K; s, min, h, d; eq, eq., equiv, equiv., x, ×; mol%, mol %; mg, g;
// mL, L; mmol; M; %; and rt, r.t., room temperature, reflux, overnight,
// o/n, cat., excess.
//
// Why the separators look as they do: SMILES hold no spaces, and may hold
// + - = # $ : / \ @ [ ] ( ) . % and digits, so
//
//   - '+' separates only as a word of its own (" + "), never inside
//     "[Na+]";
//   - ',' and the arrow never occur in SMILES and separate anywhere,
//     except a comma inside a locant list of a name ("1,4-dioxane",
//     "N,N-dimethylformamide");
//   - '(' opens an amount or note only at the start of a word whose ')'
//     is followed by a space or separator, so "(S)-4-phenylbutan-2-ol" is
//     a name and "CC(Br)C" a SMILES;
//   - the label's ':' ends the first word, where a SMILES bond cannot
//     stand; a reference starts with '@', which never begins a SMILES;
//   - "//" starts a comment only at the start or after a space, where no
//     SMILES bond can stand ('#' and '%' belong to SMILES);
//   - the marks "[x]", "[-]" and "[ ]" are no SMILES bracket atoms.
//
// Several words in a row without a separator are one name ("potassium
// phthalimide", "acetic acid"); a name of one word may be SMILES, and only
// analyze/, which knows the dictionary and the SMILES reader, can tell. A
// '/' inside a word joins a mixture ("THF/water") only when no part holds
// '=', '#', '@', brackets or parentheses, so "F/C=C/F" stays one SMILES.
// An arrow between two temperatures among the conditions is a range
// ("-78 °C -> rt"), not the reaction arrow. An arrow at the end of the
// line with nothing after it asks for the prediction and is no error.
//
// The package knows no chemistry: it classifies text by its shape and
// leaves meaning (is this a solvent? a valid SMILES?) to analyze/.
//
// # The syntax tree
//
// Parse reads one line and ParseLines the lines of a page. Both give
// Steps whose nodes live in a Tree: the text, kept once, and one slice
// of 24-byte records holding offsets, kinds and counts, but no pointers
// and no strings. Step, Term, Substance and Quantity are handles (a Tree
// and an index) whose methods read those records; the few small parts
// (Mark, Label, Sep, Arrow, Comment, Note) are returned as plain values.
// What the text already says is not stored again: texts are slices of
// the Tree's text, made on demand; a quantity's number is read again
// from it when asked for; a unit or quantity word is kept as an index
// into the tables of units.tsv and words.tsv; a term of one part is
// stored as that part. A step takes seven records or so, and a page of
// ten thousand steps read by ParseLines is some fifty allocations of
// 32 KiB that the garbage collector need not scan, rather than a hundred
// thousand small ones full of pointers, which is what makes opening a
// long notebook cheap. Lists are read with Len and At:
//
//	rs := st.Reactants()
//	for i := range rs.Len() {
//		if s, ok := rs.At(i).Substance(); ok {
//			fmt.Println(s.Kind(), s.Text())
//		}
//	}
//
// A Tree is never changed after parsing, so Steps may be shared between
// goroutines. Positions are host offsets (grammar/source) throughout.
package notation
