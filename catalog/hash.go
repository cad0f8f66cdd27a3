package catalog

import (
	"crypto/sha256"
	"encoding/hex"
	"encoding/json"
	"sort"
	"strings"
)

// Hash returns the SHA-256 (hex) of the catalog's content: every outline and
// family with all their values, in name and id order. Where an entry was
// loaded from (Origin, Replaces) is left out, so the same catalog files in
// two folders hash alike; a changed figure changes the hash.
func (c *Catalog) Hash() string {
	outs := make([]Outline, len(c.Outlines))
	copy(outs, c.Outlines)
	for i := range outs {
		outs[i].Origin = ""
	}
	sort.SliceStable(outs, func(i, j int) bool { return strings.ToLower(outs[i].Name) < strings.ToLower(outs[j].Name) })
	fams := make([]Family, len(c.Families))
	copy(fams, c.Families)
	for i := range fams {
		fams[i].Origin, fams[i].Replaces = "", ""
	}
	sort.SliceStable(fams, func(i, j int) bool { return strings.ToLower(fams[i].ID) < strings.ToLower(fams[j].ID) })
	b, err := json.Marshal(struct {
		Outlines []Outline `json:"outlines"`
		Families []Family  `json:"families"`
	}{outs, fams})
	if err != nil { // only NaN or Inf, which lint refuses; hash what can be written
		b = []byte(err.Error())
	}
	sum := sha256.Sum256(b)
	return hex.EncodeToString(sum[:])
}
