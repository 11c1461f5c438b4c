package plan

import (
	"reflect"
	"testing"
)

// TestPointIDs: our own scheme numbers each method apart, in plan order,
// with a prefix that says the method; an unknown method never takes a
// known method's prefix.
func TestPointIDs(t *testing.T) {
	got := pointIDs([]string{"boring", "cpt", "boring", "test_pit", "probe", "cpt", "vane", "b", "", "tp"})
	want := []string{"B-1", "S-1", "B-2", "TP-1", "P-1", "S-2", "VANE-1", "XB-1", "X-1", "XTP-1"}
	if !reflect.DeepEqual(got, want) {
		t.Errorf("ids %q, want %q", got, want)
	}
}
