" Vim syntax file
" Language: firn (plane building frames and their loads)
" The keyword list is grammar/keywords.hpp and the unit list is unit_names() in
" src/base/units.cpp; src/testing/editor_support_test.cpp checks both against this file.

if exists("b:current_syntax")
  finish
endif

" Unit names are case-sensitive: m and N are units, M and n are not.
syn case match
syn iskeyword @,48-57,_

syn keyword firnKeyword along amend at axial because beams case clockwise columns counterclockwise
syn keyword firnKeyword dead displacement down fixed free from grid group hinge ishape
syn keyword firnKeyword let linear live material member model moment node on other
syn keyword firnKeyword outside pinned plan point projected rafters rectangle report roller
syn keyword firnKeyword geometry tolerance unjoined cover
syn keyword firnKeyword deflection limit projection roof arrange by combinations combine half_live_in or pattern rain rotation section self snow spacing spring support tag to
syn keyword firnKeyword expect of shear reaction under between and within
syn keyword firnKeyword transverse uniform units up use weight wind x y

syn keyword firnUnit m mm cm ft in N kN MN lb lbf kip Pa kPa MPa GPa psf ksf psi ksi
syn keyword firnUnit pcf kcf plf klf rad deg

syn keyword firnFunction min max abs sqrt

" 12, 0.5, .5, 1e-3, 2.5E+4; in 1..5 the dots are the range operator.
syn match firnNumber "\%(\w\.\)\@2<!\<\d\+\%(\.\.\@!\d*\)\=\%([eE][+-]\=\d\+\)\="
syn match firnNumber "\%(\w\|\.\)\@1<!\.\d\+\%([eE][+-]\=\d\+\)\="

syn match firnOperator "\.\.\|[-+*/^=]"

syn region firnString start=+"+ skip=+\\\\\|\\"+ end=+"\|$+ contains=firnEscape oneline
syn match firnEscape "\\." contained

syn keyword firnTodo TODO FIXME XXX NOTE contained
syn match firnComment "#.*$" contains=firnTodo,@Spell

hi def link firnKeyword Statement
hi def link firnUnit Type
hi def link firnFunction Function
hi def link firnNumber Number
hi def link firnOperator Operator
hi def link firnString String
hi def link firnEscape SpecialChar
hi def link firnComment Comment
hi def link firnTodo Todo

let b:current_syntax = "firn"
