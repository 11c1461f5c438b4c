package ratebooks

import "github.com/rigmix/rigmix/scenarios/fielderr"

// FieldError is the loaders' shared error type (see package fielderr).
type FieldError = fielderr.FieldError

func nearest(word string, candidates []string) string { return fielderr.Nearest(word, candidates) }

func suggest(word string, candidates []string) string { return fielderr.Suggest(word, candidates) }
